// Migrates the test database and starts the real server (built client + API) on a loopback port.
import { spawn, type ChildProcess } from 'node:child_process'
import type { TestProject } from 'vitest/node'
import { waitForHealth } from './support/health.js'

const PORT = Number(process.env.E2E_PORT ?? 3107)

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set: run the browser suite through npm test')
  const { migrator, closeDb } = await import('../../server/db.js')
  await migrator().up()
  await closeDb()
  const server: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, PORT: String(PORT), HOST: '127.0.0.1', PUBLIC_URL: `http://127.0.0.1:${PORT}` },
    stdio: ['ignore', 'inherit', 'inherit'],
  })
  const baseUrl = `http://127.0.0.1:${PORT}`
  await waitForHealth(`${baseUrl}/api/health`, 30_000)
  project.provide('baseUrl', baseUrl)
  return async () => {
    server.kill('SIGTERM')
    await new Promise((r) => server.once('exit', r))
  }
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string
  }
}
