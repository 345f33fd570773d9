import path from 'node:path'

export interface Config {
  nodeEnv: 'development' | 'production' | 'test'
  host: string
  port: number
  databaseUrl: string
  logLevel: string
  sessionSecret: string
  trustProxy: string | number | boolean
  publicUrl: string
  smtpUrl: string | null
  mailFrom: string
  dataDir: string
  tileUrl: string | null
  tileAttribution: string
  uploadMaxBytes: number
  badRowShare: number
  bcryptCost: number
  jobPollSeconds: number
  /** Loopback port of the local SMTP sink used when SMTP_URL is unset; 0 = any free port. */
  mailSinkPort: number
  /** Sessions end after this long without a request (rolling). */
  sessionIdleMinutes: number
  /** Sessions end this long after sign-in whatever the activity. */
  sessionMaxHours: number
  /** Sign-in attempts allowed per account, and per client address, in one window. */
  loginMaxPerAccount: number
  loginMaxPerAddress: number
  loginWindowMinutes: number
}

function parseTrustProxy(v: string | undefined): string | number | boolean {
  if (v === undefined || v === '' || v === 'false') return false
  if (v === 'true') return true
  if (/^\d+$/.test(v)) return Number(v)
  return v
}

/** Reads process.env once; throws one error listing every bad variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Readonly<Config> {
  const problems: string[] = []
  const num = (name: string, def: number, min: number, max: number): number => {
    const raw = env[name]
    if (raw === undefined || raw === '') return def
    const v = Number(raw)
    if (!Number.isFinite(v) || v < min || v > max) {
      problems.push(`${name} must be a number in [${min}, ${max}], got "${raw}"`)
      return def
    }
    return v
  }
  const nodeEnv = (env.NODE_ENV ?? 'development') as Config['nodeEnv']
  if (!['development', 'production', 'test'].includes(nodeEnv)) {
    problems.push(`NODE_ENV must be development, production or test, got "${env.NODE_ENV}"`)
  }
  const databaseUrl = env.DATABASE_URL ?? ''
  if (!/^postgres(ql)?:\/\//.test(databaseUrl)) problems.push('DATABASE_URL must be a postgres:// URL')
  const sessionSecret = env.SESSION_SECRET ?? (nodeEnv === 'production' ? '' : 'dev-only-session-secret-not-for-production')
  if (sessionSecret.length < 16) problems.push('SESSION_SECRET must be at least 16 characters')
  const host = env.HOST ?? '127.0.0.1'
  const port = num('PORT', 3000, 0, 65535)
  const publicUrl = (env.PUBLIC_URL ?? `http://${host === '0.0.0.0' ? '127.0.0.1' : host}:${port}`).replace(/\/$/, '')
  const cfg: Config = {
    nodeEnv,
    host,
    port,
    databaseUrl,
    logLevel: env.LOG_LEVEL ?? (nodeEnv === 'test' ? 'silent' : 'info'),
    sessionSecret,
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    publicUrl,
    smtpUrl: env.SMTP_URL ? env.SMTP_URL : null,
    mailFrom: env.MAIL_FROM ?? 'Ellipsoid <no-reply@ellipsoid.example.test>',
    dataDir: path.resolve(env.DATA_DIR ?? '.data'),
    tileUrl: env.TILE_URL ? env.TILE_URL : null,
    tileAttribution: env.TILE_ATTRIBUTION ?? '',
    uploadMaxBytes: num('UPLOAD_MAX_MB', 200, 1, 10_000) * 1024 * 1024,
    badRowShare: num('BAD_ROW_SHARE', 0.02, 0, 1),
    bcryptCost: num('BCRYPT_COST', 12, 4, 15),
    jobPollSeconds: num('JOB_POLL_SECONDS', nodeEnv === 'test' ? 0.5 : 2, 0.5, 60),
    mailSinkPort: num('MAIL_SINK_PORT', 0, 0, 65535),
    sessionIdleMinutes: num('SESSION_IDLE_MINUTES', 480, 1, 10_080),
    sessionMaxHours: num('SESSION_MAX_HOURS', 24, 1, 720),
    loginMaxPerAccount: num('LOGIN_MAX_PER_ACCOUNT', 10, 1, 100),
    loginMaxPerAddress: num('LOGIN_MAX_PER_ADDRESS', 100, 1, 100_000),
    loginWindowMinutes: num('LOGIN_WINDOW_MINUTES', 15, 1, 1440),
  }
  if (problems.length) throw new Error(`Bad configuration:\n- ${problems.join('\n- ')}`)
  return Object.freeze(cfg)
}

let cached: Readonly<Config> | null = null
/** The process-wide configuration, parsed on first use. */
export function config(): Readonly<Config> {
  cached ??= loadConfig()
  return cached
}
