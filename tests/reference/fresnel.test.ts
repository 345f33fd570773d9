// Reference checks of group 'fresnel' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group fresnel', () => {
  describeGroup('fresnel', { describe, it, expect })
})
