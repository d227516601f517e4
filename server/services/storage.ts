// Object storage: the one module that reads and writes file bytes, through the S3 API (@aws-sdk/client-s3).
// The database keeps an object's key and metadata, never its bytes. Configuration (environment):
//   DW_S3_ENDPOINT   the S3 endpoint (locally the fake s3rver started by scripts/s3.sh; unset → AWS's own)
//   DW_S3_BUCKET     the bucket (default "dropwright"), DW_S3_REGION (us-east-1)
//   DW_S3_ACCESS_KEY / DW_S3_SECRET_KEY   credentials (else the SDK's usual chain)
// Keys are always `labs/<labId>/...`, so one lab's objects never share a prefix with another's.
import {
  DeleteObjectCommand,
  GetObjectCommand,
  PutObjectCommand,
  S3Client,
  type S3ClientConfig,
} from '@aws-sdk/client-s3'
import { createError } from 'h3'
import { useConfig } from '../utils/config'

let client: S3Client | undefined

export function storageBucket(): string {
  return useConfig().storage.bucket
}

function useStorage(): S3Client {
  if (client) return client
  const { endpoint, region, credentials } = useConfig().storage
  const config: S3ClientConfig = {
    region,
    // The local fake (and most self-hosted stores) answer path-style addresses only.
    forcePathStyle: Boolean(endpoint),
    ...(endpoint ? { endpoint } : {}),
    ...(credentials ? { credentials } : {}),
  }
  client = new S3Client(config)
  return client
}

/** A key under the lab's own prefix: `labs/<labId>/<kind>/<id>/<name>`. */
export function objectKey(labId: string, kind: string, id: string, name: string): string {
  return `labs/${labId}/${kind}/${id}/${name}`
}

const unavailable = (error: unknown) =>
  createError({
    statusCode: 503,
    statusMessage: 'Service Unavailable',
    message: `File storage cannot be reached right now; try again in a minute (${error instanceof Error ? error.name : 'error'})`,
    data: { retryAfterSeconds: 5 },
  })

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  try {
    await useStorage().send(
      new PutObjectCommand({
        Bucket: storageBucket(),
        Key: key,
        Body: body,
        ContentType: contentType,
        ContentLength: body.byteLength,
      }),
    )
  } catch (error) {
    throw unavailable(error)
  }
}

export async function getObject(key: string): Promise<Uint8Array> {
  try {
    const answer = await useStorage().send(new GetObjectCommand({ Bucket: storageBucket(), Key: key }))
    if (!answer.Body) throw new Error('empty body')
    return await answer.Body.transformToByteArray()
  } catch (error) {
    if ((error as { name?: string }).name === 'NoSuchKey')
      throw createError({ statusCode: 404, statusMessage: 'Not Found', message: 'No such file' })
    throw unavailable(error)
  }
}

export async function deleteObject(key: string): Promise<void> {
  try {
    await useStorage().send(new DeleteObjectCommand({ Bucket: storageBucket(), Key: key }))
  } catch (error) {
    throw unavailable(error)
  }
}
