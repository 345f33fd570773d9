// Reference checks of group 'fspl' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group fspl', () => {
  describeGroup('fspl', { describe, it, expect })
})
