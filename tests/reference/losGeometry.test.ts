// Reference checks of group 'los_geometry' from fixtures/reference/check-values.json; sources named in each title.
import { describe, expect, it } from 'vitest'
import { describeGroup } from './checkValues.js'

describe('reference group los_geometry', () => {
  describeGroup('los_geometry', { describe, it, expect })
})
