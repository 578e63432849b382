// useLoader keeps a grid's rows as they came when asked to (`shallow`): no reactive proxy per row, so a grid that
// reads every field of thousands of rows does not track each read, while a new answer still updates the page; by
// default an answer stays deeply reactive, as the forms that edit loaded data in place expect.
// source: Vue 3 documentation, Reactivity API: Advanced, shallowRef() ("the inner value is stored and exposed as-is,
// and will not be made deeply reactive"); AG Grid's Vue guide on keeping row data out of Vue's reactivity.
import { describe, expect, it } from 'vitest'
import { effect, isReactive } from 'vue'
import { useLoader } from '@/composables/useApiAction'

const answer = () => ({ rows: [{ sku: 'GB-8-CLR', onHand: 12 }, { sku: 'GB-8-ICE', onHand: 0 }] })

describe('useLoader', () => {
  it('keeps the answer as it came when shallow, and still updates on a new answer', async () => {
    const first = answer()
    let next = first
    const { data, reload } = useLoader(() => Promise.resolve(next), { shallow: true })
    let seen = 0
    effect(() => {
      void data.value
      seen++
    })
    await reload()
    expect(data.value).toBe(first) // the very object the API gave, no proxy
    expect(isReactive(data.value!.rows)).toBe(false)
    expect(isReactive(data.value!.rows[0])).toBe(false)
    const before = seen
    data.value!.rows[0].onHand = 5 // a field changed in place is not watched
    expect(seen).toBe(before)
    next = answer()
    await reload()
    expect(data.value).toBe(next)
    expect(seen).toBe(before + 1) // a new answer is
  })

  it('makes the answer deeply reactive by default', async () => {
    const { data, reload } = useLoader(() => Promise.resolve(answer()))
    await reload()
    expect(isReactive(data.value!.rows[0])).toBe(true)
  })
})
