// Local S3-compatible object storage on loopback (s3rver), for `npm start` and `npm test`.
//   tsx scripts/fakes/storage.ts --port 4568 --dir .data/s3
import { mkdirSync } from "node:fs";
import { parseArgs } from "node:util";
import S3rver from "s3rver";

const { values } = parseArgs({ options: { port: { type: "string", default: "4568" }, dir: { type: "string", default: ".data/s3" } } });
mkdirSync(values.dir!, { recursive: true });

const server = new S3rver({
  address: "127.0.0.1",
  port: Number(values.port),
  directory: values.dir!,
  silent: true,
  configureBuckets: [{ name: process.env.S3_BUCKET ?? "darnwell", configs: [] }],
});

server.run().then(() => console.log(`storage: S3 fake on http://127.0.0.1:${values.port}`));

const stop = () => {
  server.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
