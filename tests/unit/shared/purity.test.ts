// Guards the shared/ rule: pure TypeScript, no I/O, no platform APIs, clock and randomness as arguments.
import { describe, expect, it } from 'vitest'
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { fileURLToPath } from 'node:url'

const sharedDir = fileURLToPath(new URL('../../../shared/', import.meta.url))

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    if (statSync(path).isDirectory()) return sourceFiles(path)
    return name.endsWith('.ts') ? [path] : []
  })
}

const files = sourceFiles(sharedDir).map((path) => ({ path: relative(sharedDir, path), text: readFileSync(path, 'utf8') }))
const importsOf = (text: string) => [...text.matchAll(/(?:import|export)[^'"]*?from\s+['"]([^'"]+)['"]/g)].map((m) => m[1]!)

// packages that bring I/O, a framework or a runtime into code both sides share
const FORBIDDEN_PACKAGES = /^(node:|fs$|path$|http|https$|url$|crypto$|child_process$|vue|express|sequelize|pinia|pg|element-plus|axios|@vue\/)/
// platform globals, the clock and randomness
const FORBIDDEN_CALLS = /\b(fetch\(|window\.|document\.|process\.|localStorage|Date\.now\(|new Date\(|Math\.random\(|performance\.now\()/

describe('shared/ purity', () => {
  it('finds the shared sources', () => expect(files.length).toBeGreaterThan(20))
  it('imports no Node, browser, framework or database package', () => {
    const bad = files.flatMap((f) => importsOf(f.text).filter((s) => FORBIDDEN_PACKAGES.test(s)).map((s) => `${f.path}: ${s}`))
    expect(bad).toEqual([])
  })
  it('never reads the clock, randomness or platform globals', () => {
    // comments and string literals may mention these words; only code counts
    const code = (t: string) =>
      t
        .replace(/\/\*[\s\S]*?\*\//g, '')
        .replace(/\/\/.*$/gm, '')
        .replace(/'(?:[^'\\\n]|\\.)*'|"(?:[^"\\\n]|\\.)*"/g, "''")
    const bad = files.filter((f) => FORBIDDEN_CALLS.test(code(f.text)))
    expect(bad.map((f) => f.path)).toEqual([])
  })
  it('ends every relative import with .js', () => {
    const bad = files.flatMap((f) => importsOf(f.text).filter((s) => s.startsWith('.') && !s.endsWith('.js')).map((s) => `${f.path}: ${s}`))
    expect(bad).toEqual([])
  })
  it('keeps the radio-link core free of packages: only relative imports', () => {
    const core = /^(units|geo|rf|antenna|stats|propagation|fresnel|dropouts|analysis)\//
    const bad = files
      .filter((f) => core.test(f.path.replaceAll('\\', '/')))
      .flatMap((f) => importsOf(f.text).filter((s) => !s.startsWith('.')).map((s) => `${f.path}: ${s}`))
    expect(bad).toEqual([])
  })
})
