// Reference checks of group 'friis' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group friis', () => {
  describeGroup('friis', { describe, it, expect })
})
