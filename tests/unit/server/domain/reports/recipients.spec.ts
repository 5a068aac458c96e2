// Who a service report may go to (the product's own rule: site contacts and the organisation's
// people; other addresses only when an engineer or admin sends it).
import { describe, expect, it } from 'vitest'
import { refusedRecipients, refusedRecipientsMessage, reportRecipientList } from '#server/domain/reports/recipients'

const contacts = [
  { name: 'Petra Lind', email: 'Petra.Lind@site.example', receivesReports: true },
  { name: 'Gate desk', email: 'desk@site.example', receivesReports: false },
]
const colleagues = [
  { name: 'Dev H', email: 'dev@team.example' },
  { name: 'Petra at the team too', email: 'petra.lind@site.example' },
]

describe('report recipients', () => {
  it('lists the site contacts first, then colleagues not already listed', () => {
    const list = reportRecipientList(contacts, colleagues)
    expect(list.map((r) => [r.email, r.kind, r.preselected])).toEqual([
      ['Petra.Lind@site.example', 'contact', true],
      ['desk@site.example', 'contact', false],
      ['dev@team.example', 'colleague', false],
    ])
  })

  it('refuses addresses off the list in any letter case, each once; none when any address is allowed', () => {
    const list = reportRecipientList(contacts, colleagues)
    expect(refusedRecipients(['PETRA.LIND@site.example', 'dev@team.example'], list, false)).toEqual([])
    expect(refusedRecipients(['x@out.example', 'desk@site.example', 'X@Out.example', 'y@out.example'], list, false)).toEqual(['x@out.example', 'y@out.example'])
    expect(refusedRecipients(['x@out.example'], list, true)).toEqual([])
  })

  it('names every refused address in the message', () => {
    expect(refusedRecipientsMessage(['x@out.example'])).toMatch(/x@out\.example is neither/)
    expect(refusedRecipientsMessage(['x@out.example', 'y@out.example'])).toMatch(/x@out\.example, y@out\.example are neither/)
  })
})
