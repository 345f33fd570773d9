import fs from 'node:fs'
import path from 'node:path'
import multer from 'multer'
import type { RequestHandler } from 'express'
import { config } from '../config.js'
import { HttpError } from '../errors.js'
import { serverFileName, tmpDir } from '../services/flights/storage.js'

const LOG_EXTENSIONS = /\.(csv|txt|tsv|log|gpx)(\.gz)?$/i

/**
 * multer for flight uploads only (never global): disk storage under the data folder with server-made names, every
 * limit set, and a name allowlist (the content is checked again after the upload, by its bytes).
 * Fields: `file` (required) and `signalFile` (optional signal log for a GPX track).
 */
export function flightUpload(): RequestHandler {
  const dir = tmpDir()
  fs.mkdirSync(dir, { recursive: true })
  const upload = multer({
    storage: multer.diskStorage({
      destination: dir,
      filename: (_req, _file, cb) => cb(null, serverFileName()),
    }),
    limits: {
      fileSize: config().uploadMaxBytes,
      files: 2,
      fields: 20,
      fieldSize: 64 * 1024,
      fieldNameSize: 100,
      parts: 25,
      headerPairs: 100,
    },
    fileFilter: (_req, file, cb) => {
      if (LOG_EXTENSIONS.test(path.basename(file.originalname))) return cb(null, true)
      cb(new HttpError(415, 'UNSUPPORTED_MEDIA_TYPE', 'Upload a .csv, .txt, .tsv, .log or .gpx file, optionally gzip-compressed (.gz)'))
    },
  })
  return upload.fields([
    { name: 'file', maxCount: 1 },
    { name: 'signalFile', maxCount: 1 },
  ])
}
