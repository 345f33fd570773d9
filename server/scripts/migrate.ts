// `npm run db:migrate` / `db:migrate:undo`: apply every pending migration, or undo the last one.
import { closeDb, migrator } from '../db.js'

const dir = process.argv[2] ?? 'up'
const m = migrator()
const r = dir === 'down' ? await m.down() : await m.up()
console.log(`${dir}: ${r.map((x) => x.name).join(', ') || 'nothing to do'}`)
await closeDb()
