import * as Minio from 'minio'
import type { Readable } from 'node:stream'
import type { AppConfig } from '../config/config'

/** Object storage for photos, overlays and reports: the local S3 fake in development, real storage in production. */
export class StorageService {
  private readonly client: Minio.Client

  constructor(private readonly config: Pick<AppConfig, 'S3_ENDPOINT' | 'S3_BUCKET' | 'S3_ACCESS_KEY' | 'S3_SECRET_KEY' | 'S3_REGION'>) {
    const endpoint = new URL(config.S3_ENDPOINT)
    const useSSL = endpoint.protocol === 'https:'
    this.client = new Minio.Client({
      endPoint: endpoint.hostname,
      port: Number(endpoint.port || (useSSL ? 443 : 80)),
      useSSL,
      accessKey: config.S3_ACCESS_KEY,
      secretKey: config.S3_SECRET_KEY,
      region: config.S3_REGION,
      pathStyle: true,
    })
  }

  get bucket(): string {
    return this.config.S3_BUCKET
  }

  async ensureBucket(): Promise<void> {
    if (!(await this.client.bucketExists(this.bucket))) await this.client.makeBucket(this.bucket, this.config.S3_REGION)
  }

  /** Cheap round trip used by the health check. */
  async ping(): Promise<void> {
    const exists = await this.client.bucketExists(this.bucket)
    if (!exists) throw new Error(`bucket ${this.bucket} is missing`)
  }

  async put(key: string, body: Buffer, contentType: string): Promise<void> {
    await this.client.putObject(this.bucket, key, body, body.length, { 'Content-Type': contentType })
  }

  async getBuffer(key: string): Promise<Buffer> {
    const stream: Readable = await this.client.getObject(this.bucket, key)
    const chunks: Buffer[] = []
    for await (const chunk of stream) chunks.push(chunk as Buffer)
    return Buffer.concat(chunks)
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.statObject(this.bucket, key)
      return true
    } catch (error) {
      if ((error as { code?: string }).code === 'NotFound') return false
      throw error
    }
  }

  async remove(key: string): Promise<void> {
    await this.client.removeObject(this.bucket, key)
  }

  async listKeys(prefix = ''): Promise<string[]> {
    const keys: string[] = []
    for await (const item of this.client.listObjectsV2(this.bucket, prefix, true)) {
      if (item.name) keys.push(item.name)
    }
    return keys
  }

  /** A short-lived URL for one object, so photos reach only people the server already authorised. */
  presignedGet(key: string, expirySeconds = 300): Promise<string> {
    return this.client.presignedGetObject(this.bucket, key, expirySeconds)
  }
}
