// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import MessageBody from '@/components/outbox/MessageBody.vue'

describe('MessageBody', () => {
  it('makes http(s) links clickable, without the full stop after them, and keeps the rest as text', () => {
    const text = 'Join here:\nhttp://127.0.0.1:3000/accept-invite?token=abc123.\nThanks'
    const w = mount(MessageBody, { props: { text } })
    const links = w.findAll('a')
    expect(links.map((a) => a.attributes('href'))).toEqual(['http://127.0.0.1:3000/accept-invite?token=abc123'])
    expect(w.text()).toContain('Thanks')
  })

  it('never renders markup from the message', () => {
    const w = mount(MessageBody, { props: { text: '<img src=x onerror=alert(1)> javascript:alert(1)' } })
    expect(w.find('img').exists()).toBe(false)
    expect(w.findAll('a')).toHaveLength(0)
  })
})
