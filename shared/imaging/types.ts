/** An 8-bit grey image, row-major, one byte per pixel (0 black, 255 white). */
export interface GreyImage {
  width: number
  height: number
  data: Uint8Array
}
