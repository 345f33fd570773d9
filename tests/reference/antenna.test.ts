// Reference checks of group 'antenna' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group antenna', () => {
  describeGroup('antenna', { describe, it, expect })
})
