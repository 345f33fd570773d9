import type { Server } from 'node:http'
import { config } from './config.js'
import { logger } from './logger.js'
import { closeDb, sequelize } from './db.js'
import { createApp } from './app.js'
import { startBackground, stopBackground } from './background.js'

async function main(): Promise<void> {
  const cfg = config()
  await sequelize().authenticate()
  await startBackground()
  const app = createApp()
  const server: Server = app.listen(cfg.port, cfg.host, () => {
    logger.info(`Ellipsoid listening on http://${cfg.host}:${cfg.port}`)
  })
  let stopping = false
  const stop = (signal: string) => {
    if (stopping) return
    stopping = true
    logger.info(`${signal}: finishing in-flight requests`)
    server.close(async () => {
      await stopBackground()
      await closeDb()
      process.exit(0)
    })
    server.closeIdleConnections()
    setTimeout(() => process.exit(0), 25_000).unref()
  }
  process.on('SIGINT', () => stop('SIGINT'))
  process.on('SIGTERM', () => stop('SIGTERM'))
}

main().catch((err: Error) => {
  console.error(`Ellipsoid failed to start: ${err.message}`)
  process.exit(1)
})
