// Imported first by suites that need a small upload limit: sets it before anything reads config().
process.env.UPLOAD_MAX_MB = '3'
