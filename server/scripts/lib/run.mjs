// Plain Node helpers for the bootstrap: it runs before any dependency is installed.
import { spawn, spawnSync } from 'node:child_process'
import fs from 'node:fs'
import path from 'node:path'

export const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), '../../..')
export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0

export function say(msg) {
  process.stdout.write(`[ellipsoid] ${msg}\n`)
}

/** Runs a command to completion, inheriting stdio; returns the exit code. */
export function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: ROOT, ...opts })
  if (r.error) throw r.error
  return r.status ?? 1
}

/** Runs a command and throws when it fails. */
export function must(cmd, args, opts = {}) {
  const code = run(cmd, args, opts)
  if (code !== 0) throw new Error(`${cmd} ${args.join(' ')} exited with ${code}`)
}

/** Runs a command asynchronously; resolves with its exit code. */
export function runAsync(cmd, args, opts = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: 'inherit', cwd: ROOT, ...opts })
    child.on('error', reject)
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)))
  })
}

export function which(name) {
  const r = spawnSync('sh', ['-c', `command -v ${name}`], { encoding: 'utf8' })
  return r.status === 0 ? r.stdout.trim() : null
}

/** Newest modification time (ms) under the given paths, skipping node_modules. */
export function newestMtime(paths) {
  let newest = 0
  const walk = (p) => {
    let st
    try {
      st = fs.statSync(p)
    } catch {
      return
    }
    if (st.isDirectory()) {
      if (path.basename(p) === 'node_modules') return
      for (const e of fs.readdirSync(p)) walk(path.join(p, e))
    } else newest = Math.max(newest, st.mtimeMs)
  }
  for (const p of paths) walk(path.join(ROOT, p))
  return newest
}

/** `npm ci` when node_modules is missing or older than package-lock.json. */
export function ensureDependencies() {
  const marker = path.join(ROOT, 'node_modules', '.package-lock.json')
  const lock = path.join(ROOT, 'package-lock.json')
  const stale = !fs.existsSync(marker) || fs.statSync(marker).mtimeMs < fs.statSync(lock).mtimeMs
  if (!stale) return
  say('installing dependencies (npm ci)…')
  must('npm', ['ci', '--no-audit', '--no-fund'])
}

/** Builds the client when its sources are newer than dist/. */
export function ensureClientBuild() {
  const built = path.join(ROOT, 'dist', 'index.html')
  const builtAt = fs.existsSync(built) ? fs.statSync(built).mtimeMs : 0
  const sources = newestMtime(['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package-lock.json'])
  if (builtAt >= sources) return
  say('building the client (vite build)…')
  must(path.join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'])
}

/** Path of an installed command-line tool (node_modules/.bin). */
export function bin(name) {
  return path.join(ROOT, 'node_modules', '.bin', name)
}

/** SESSION_SECRET when set, else one generated once into .data so restarts keep sessions valid. */
export function sessionSecret() {
  return process.env.SESSION_SECRET ?? persistentSecret(path.join(ROOT, '.data'), 'session-secret')
}

/** A secret kept in .data so restarts keep sessions valid. */
export function persistentSecret(dataDir, name, bytes = 32) {
  fs.mkdirSync(dataDir, { recursive: true })
  const file = path.join(dataDir, name)
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim()
  const value = Buffer.from(crypto.getRandomValues(new Uint8Array(bytes))).toString('hex')
  fs.writeFileSync(file, value + '\n', { mode: 0o600 })
  return value
}
