// Reference checks of group 'two_ray' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group two_ray', () => {
  describeGroup('two_ray', { describe, it, expect })
})
