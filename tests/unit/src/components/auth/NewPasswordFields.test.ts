// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest'
import { defineComponent, h, reactive, ref } from 'vue'
import { mount } from '@vue/test-utils'
import ElementPlus, { ElForm, type FormInstance } from 'element-plus'
import { passwordSchema } from '@shared/schemas/auth'
import { sameAsRule, zodRule } from '@/composables/useFormErrors'
import NewPasswordFields from '@/components/auth/NewPasswordFields.vue'

/** A form as the views build it: the fields' values and rules live in the parent. */
function mountForm(props: Record<string, unknown> = {}) {
  const form = reactive({ newPassword: '', confirm: '' })
  const formRef = ref<FormInstance>()
  const Host = defineComponent({
    setup() {
      const rules = { newPassword: [zodRule(passwordSchema)], confirm: [sameAsRule(() => form.newPassword)] }
      return () =>
        h(ElForm, { ref: formRef, model: form, rules }, () =>
          h(NewPasswordFields, {
            prop: 'newPassword',
            password: form.newPassword,
            'onUpdate:password': (v: string) => (form.newPassword = v),
            confirm: form.confirm,
            'onUpdate:confirm': (v: string) => (form.confirm = v),
            ...props,
          }),
        )
    },
  })
  const wrapper = mount(Host, { global: { plugins: [ElementPlus] }, attachTo: document.body })
  return { wrapper, form, formRef }
}

describe('NewPasswordFields', () => {
  it('labels the repeat after the first field and names the inputs only when asked', () => {
    const plain = mountForm({ label: 'New password' })
    expect(plain.wrapper.findAll('.el-form-item__label').map((l) => l.text())).toEqual(['New password', 'New password again'])
    expect(plain.wrapper.find('input[name]').exists()).toBe(false)
    const named = mountForm({ named: true, hint: 'A short sentence works well.' })
    expect(named.wrapper.findAll('input').map((i) => i.attributes('name'))).toEqual(['password', 'confirm'])
    expect(named.wrapper.text()).toContain('characters. A short sentence works well.')
  })

  it('writes typing back to the parent form, whose rules then judge the pair', async () => {
    const { wrapper, form, formRef } = mountForm()
    const [first, again] = wrapper.findAll('input')
    await first!.setValue('field day 2026!')
    await again!.setValue('field day 2025!')
    expect(form).toEqual({ newPassword: 'field day 2026!', confirm: 'field day 2025!' })
    const invalid = (await formRef.value!.validate().catch((fields: unknown) => fields)) as Record<string, { message: string }[]>
    expect(Object.keys(invalid)).toEqual(['confirm'])
    expect(invalid.confirm?.[0]?.message).toBe('The two passwords are not the same')
    await again!.setValue('field day 2026!')
    expect(await formRef.value!.validate()).toBe(true)
  })
})
