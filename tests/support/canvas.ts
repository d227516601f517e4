// World µm → page CSS px on a chip canvas (viewer or editor), from the view the canvas reports in `data-view`
// ("scale tx ty"), so a test clicks the right spot however Fit framed the chip (beside or below the layer panel).
import type { Page } from 'playwright-core'

export async function worldOnPage(
  page: Page,
  selector: string,
  x: number,
  y: number,
): Promise<{ x: number; y: number }> {
  const frame = page.locator(selector)
  const b = (await frame.boundingBox())!
  const [scale, tx, ty] = (await frame.getAttribute('data-view'))!.split(' ').map(Number) as [number, number, number]
  return { x: b.x + tx + scale * x, y: b.y + ty - scale * y }
}
