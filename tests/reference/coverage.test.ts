// Guards that the reference suites cover every check of fixtures/reference/check-values.json.
import { describe, expect, it } from 'vitest'
import { readdirSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { checkFile, evaluators } from './checkValues.js'

describe('reference check coverage', () => {
  it('holds the 561 checks the handbook lists', () => {
    expect(checkFile.checks.length).toBe(checkFile.count)
    expect(checkFile.count).toBe(561)
  })
  it('has a library evaluator for every fn', () => {
    const missing = [...new Set(checkFile.checks.map((c) => c.fn))].filter((fn) => !(fn in evaluators))
    expect(missing).toEqual([])
  })
  it('has one suite file per group', () => {
    const dir = fileURLToPath(new URL('./', import.meta.url))
    const files = readdirSync(dir)
    const groups = [...new Set(checkFile.checks.map((c) => c.group))]
    const camel = (g: string) => g.replace(/_(.)/g, (_, ch: string) => ch.toUpperCase())
    expect(groups.filter((g) => !files.includes(`${camel(g)}.test.ts`))).toEqual([])
  })
  it('has unique check ids', () => {
    const ids = checkFile.checks.map((c) => c.id)
    expect(new Set(ids).size).toBe(ids.length)
  })
})
