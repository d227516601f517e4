// A local stand-in for S3 object storage, for `npm start`, `npm run dev` and `npm test`: s3rver on 127.0.0.1 keeping
// objects under .data/s3/ (or DW_S3_DIR), with the bucket the app is configured for. It reaches nothing outside.
//
//   npx tsx scripts/fake-s3.ts PORT [BUCKET]
//
// Started and stopped by scripts/s3.sh, like scripts/fake-smtp.ts by scripts/smtp.sh.
import { mkdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import S3rver from 's3rver'

const port = Number(process.argv[2] ?? process.env.DW_S3_PORT)
const bucket = process.argv[3] ?? process.env.DW_S3_BUCKET ?? 'dropwright'
if (!Number.isInteger(port) || port <= 0) {
  console.error('usage: tsx scripts/fake-s3.ts PORT [BUCKET] (or set DW_S3_PORT)')
  process.exit(64)
}
const directory = resolve(process.env.DW_S3_DIR ?? join(process.cwd(), '.data/s3'))
mkdirSync(directory, { recursive: true })

const server = new S3rver({
  port,
  address: '127.0.0.1',
  directory,
  silent: true,
  configureBuckets: [{ name: bucket, configs: [] }],
})
await server.run()
console.log(`Dropwright local fake S3 on http://127.0.0.1:${port} (bucket ${bucket}, objects in ${directory})`)
const stop = () => {
  server.close().finally(() => process.exit(0))
}
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
