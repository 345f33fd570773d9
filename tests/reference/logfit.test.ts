// Reference checks of group 'logfit' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group logfit', () => {
  describeGroup('logfit', { describe, it, expect })
})
