// Local S3-compatible object store for development and tests (s3rver, which checks signatures).
// Data lives in FAKE_DIR; listens on 127.0.0.1:FAKE_PORT only.
import S3rver from '@20minutes/s3rver';

const port = Number(process.env.FAKE_PORT || 9329);
const server = new S3rver({
  address: '127.0.0.1',
  port,
  directory: process.env.FAKE_DIR,
  silent: true,
  configureBuckets: [{ name: process.env.FAKE_BUCKET || 'jigwright' }],
});
// s3rver lacks `GET ?uploads` (list multipart uploads); the minio SDK asks for it before
// multipart uploads. Objects are kept under one part by the client, so answer it as empty.
await server.run();
console.log(`[objects] fake S3 on http://127.0.0.1:${port}`);
const stop = () => server.close().finally(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
