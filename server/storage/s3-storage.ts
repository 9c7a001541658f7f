import { createReadStream } from "node:fs";
import { rm, stat } from "node:fs/promises";
import path from "node:path";
import type { Readable } from "node:stream";
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";
import type { FileStorage } from "./file-storage.ts";

const KEY = /^[a-f0-9]{64}$/;
// Objects live under one prefix, so the bucket may hold other things and the sweep only ever lists ours.
const PREFIX = "store/";

export interface S3StorageOptions {
  endpoint?: string | undefined;
  bucket: string;
  region: string;
  accessKeyId?: string | undefined;
  secretAccessKey?: string | undefined;
  /** Path-style URLs (http://host/bucket/key), which most self-hosted S3-compatible servers need. */
  forcePathStyle: boolean;
  /** Local folder multer writes incoming uploads to before they are committed (always on this machine's disk). */
  incomingDir: string;
}

function checkedKey(key: string): string {
  // Keys are hashes we computed; anything else is refused, as in the folder driver.
  if (!KEY.test(key)) throw new Error("Invalid storage key");
  return PREFIX + key;
}

function isNotFound(err: unknown): boolean {
  return (
    err instanceof S3ServiceException &&
    (err.$metadata.httpStatusCode === 404 || err.name === "NotFound" || err.name === "NoSuchKey")
  );
}

/**
 * Files in an S3-compatible bucket under store/<sha256>. Uploads still arrive in a local incoming folder (multer writes
 * to disk) and are committed with PutObject only after the database row commits, exactly like the folder driver's
 * rename, so a failed insert never leaves an object behind.
 */
export function createS3Storage(options: S3StorageOptions): FileStorage {
  const client = new S3Client({
    region: options.region,
    endpoint: options.endpoint,
    forcePathStyle: options.forcePathStyle,
    // Checksums only where S3 requires them: the SDK's default adds aws-chunked trailers that many S3-compatible
    // servers store as part of the object; the content is addressed by its SHA-256 anyway.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    credentials:
      options.accessKeyId && options.secretAccessKey
        ? { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey }
        : undefined,
  });
  const Bucket = options.bucket;
  const exists = async (key: string) => {
    try {
      await client.send(new HeadObjectCommand({ Bucket, Key: checkedKey(key) }));
      return true;
    } catch (err) {
      if (isNotFound(err)) return false;
      throw err;
    }
  };

  return {
    incomingDir: path.resolve(options.incomingDir),
    async commit(tempPath, key) {
      // Content-addressed: an object already under this hash holds the same bytes.
      if (!(await exists(key))) {
        const { size } = await stat(tempPath);
        await client.send(
          new PutObjectCommand({
            Bucket,
            Key: checkedKey(key),
            Body: createReadStream(tempPath),
            ContentLength: size,
          }),
        );
      }
      await rm(tempPath, { force: true });
    },
    async open(key) {
      const answer = await client.send(new GetObjectCommand({ Bucket, Key: checkedKey(key) }));
      return answer.Body as Readable;
    },
    exists,
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: checkedKey(key) }));
    },
    async *keys() {
      let ContinuationToken: string | undefined;
      do {
        const page = await client.send(
          new ListObjectsV2Command({ Bucket, Prefix: PREFIX, ContinuationToken }),
        );
        for (const object of page.Contents ?? []) {
          const key = object.Key?.slice(PREFIX.length);
          if (key && KEY.test(key)) yield key;
        }
        ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (ContinuationToken);
    },
  };
}
