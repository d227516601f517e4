// The planner's target form: cell loading is typed in millions per mL and reaches the plan in cells per mL.
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import PlannerTargetForm from '../../../components/planner/PlannerTargetForm.vue'

const submitted = async (cells: string) => {
  const w = mount(PlannerTargetForm, { props: { busy: false } })
  await w.get('[data-test="planner-cells"]').setValue(cells)
  await w.get('form').trigger('submit')
  return w.emitted('submit')![0]![0] as { cellsPerMl: number | null }
}

describe('PlannerTargetForm', () => {
  it('shows the default loading as 2 (million per mL), not 2000000', () => {
    const w = mount(PlannerTargetForm, { props: { busy: false } })
    expect((w.get('[data-test="planner-cells"]').element as HTMLInputElement).value).toBe('2')
    expect(w.text()).toContain('millions per mL')
  })

  it('sends 2.5 million per mL as 2,500,000 cells/mL, and an empty field as none', async () => {
    expect((await submitted('2.5')).cellsPerMl).toBe(2_500_000)
    expect((await submitted('')).cellsPerMl).toBeNull()
  })
})
