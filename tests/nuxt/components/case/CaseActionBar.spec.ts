import { mountSuspended } from '@nuxt/test-utils/runtime'
import { describe, expect, it } from 'vitest'
import CaseActionBar from '~/components/case/CaseActionBar.vue'

describe('CaseActionBar', () => {
  it('offers the four case actions on an open case and opens the chosen panel', async () => {
    const wrapper = await mountSuspended(CaseActionBar, { props: { active: null, closed: false } })
    expect(wrapper.findAll('button').map((b) => b.text())).toEqual(['Add reading', 'Record test', 'Note', 'Photo'])
    await wrapper.findAll('button')[1]!.trigger('click')
    expect(wrapper.emitted('open')).toEqual([['test']])
  })

  it('offers only an addendum on a closed case, with no disabled buttons left over', async () => {
    const wrapper = await mountSuspended(CaseActionBar, { props: { active: null, closed: true } })
    expect(wrapper.findAll('button').map((b) => b.text())).toEqual(['Addendum'])
    expect(wrapper.findAll('button[disabled]')).toHaveLength(0)
    await wrapper.get('button').trigger('click')
    expect(wrapper.emitted('open')).toEqual([['note']])
  })
})
