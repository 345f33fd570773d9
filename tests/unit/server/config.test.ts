import { describe, expect, it } from 'vitest'
import { loadConfig } from '../../../server/config.js'

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db' }

describe('loadConfig', () => {
  it('fills every default from a minimal environment', () => {
    const cfg = loadConfig({ ...base })
    expect(cfg).toMatchObject({
      nodeEnv: 'development',
      host: '127.0.0.1',
      port: 3000,
      publicUrl: 'http://127.0.0.1:3000',
      smtpUrl: null,
      trustProxy: false,
      bcryptCost: 12,
      mailSinkPort: 0,
      sessionIdleMinutes: 480,
      sessionMaxHours: 24,
      loginMaxPerAccount: 10,
      loginMaxPerAddress: 100,
      loginWindowMinutes: 15,
    })
    expect(Object.isFrozen(cfg)).toBe(true)
  })

  it('reads numbers, the public URL without its trailing slash, and SMTP_URL', () => {
    const cfg = loadConfig({
      ...base,
      PORT: '8080',
      PUBLIC_URL: 'https://ranges.example.test/',
      SMTP_URL: 'smtp://mail.example.test:587',
      BCRYPT_COST: '4',
      MAIL_SINK_PORT: '2525',
      LOGIN_MAX_PER_ACCOUNT: '5',
    })
    expect(cfg).toMatchObject({ port: 8080, publicUrl: 'https://ranges.example.test', smtpUrl: 'smtp://mail.example.test:587', bcryptCost: 4, mailSinkPort: 2525, loginMaxPerAccount: 5 })
  })

  it('builds the public URL from HOST and PORT, using loopback for 0.0.0.0', () => {
    expect(loadConfig({ ...base, HOST: '0.0.0.0', PORT: '4000' }).publicUrl).toBe('http://127.0.0.1:4000')
  })

  it.each([
    ['false', false],
    ['true', true],
    ['2', 2],
    ['loopback', 'loopback'],
  ])('parses TRUST_PROXY=%s', (raw, expected) => {
    expect(loadConfig({ ...base, TRUST_PROXY: raw }).trustProxy).toBe(expected)
  })

  it('throws one error listing every bad variable', () => {
    const bad = () => loadConfig({ DATABASE_URL: 'mysql://x', PORT: 'eighty', BCRYPT_COST: '31', NODE_ENV: 'staging', SESSION_SECRET: 'short' })
    expect(bad).toThrow(/DATABASE_URL/)
    expect(bad).toThrow(/PORT/)
    expect(bad).toThrow(/BCRYPT_COST/)
    expect(bad).toThrow(/NODE_ENV/)
    expect(bad).toThrow(/SESSION_SECRET/)
  })

  it('requires SESSION_SECRET in production but not in development', () => {
    expect(() => loadConfig({ ...base, NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/)
    expect(loadConfig({ ...base }).sessionSecret.length).toBeGreaterThanOrEqual(16)
  })

  it('refuses a bcrypt cost below 4 and a negative sink port', () => {
    expect(() => loadConfig({ ...base, BCRYPT_COST: '3' })).toThrow(/BCRYPT_COST/)
    expect(() => loadConfig({ ...base, MAIL_SINK_PORT: '-1' })).toThrow(/MAIL_SINK_PORT/)
  })
})
