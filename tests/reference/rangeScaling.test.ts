// Reference checks of group 'range_scaling' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group range_scaling', () => {
  describeGroup('range_scaling', { describe, it, expect })
})
