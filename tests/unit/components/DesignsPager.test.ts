// The designs list's pager writes its counts through shared/format: a narrow space groups five digits and more
// (SI Brochure 9th ed. §5.4.4), never a comma ("12,470" reads as 12.47 in much of the world).
import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import DesignsPager from '../../../components/designs/DesignsPager.vue'

describe('DesignsPager', () => {
  it("counts a large lab's designs without a comma", () => {
    const w = mount(DesignsPager, { props: { page: 201, pageSize: 50, total: 12470 } })
    expect(w.get('[data-test="designs-range"]').text()).toBe('Designs 10\u202F001–10\u202F050 of 12\u202F470')
    expect(w.text()).toContain('Page 201 of 250')
  })
  it('small counts stay as they are', () => {
    const w = mount(DesignsPager, { props: { page: 1, pageSize: 50, total: 56 } })
    expect(w.get('[data-test="designs-range"]').text()).toBe('Designs 1–50 of 56')
  })
})
