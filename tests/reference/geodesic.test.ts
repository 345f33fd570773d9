// Reference checks of group 'geodesic' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group geodesic', () => {
  describeGroup('geodesic', { describe, it, expect })
})
