// Reference checks of group 'units' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group units', () => {
  describeGroup('units', { describe, it, expect })
})
