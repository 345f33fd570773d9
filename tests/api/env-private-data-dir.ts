// Imported first by suites that look inside the upload folders: a data folder of their own (other suites and
// engineers share ./.data), set before anything reads config().
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'

process.env.DATA_DIR = fs.mkdtempSync(path.join(os.tmpdir(), 'ellipsoid-test-data-'))
