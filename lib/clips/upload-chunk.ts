/**
 * Bytes per tus PATCH from the browser. Into S3 one PATCH becomes several parts (S3_PART_SIZE_MIB, 8 MiB)
 * sent side by side, and the bookkeeping every request pays (upload lock, ListParts, the trailing short
 * part) comes once per 64 MiB instead of once per part: bench/upload/s3.ts measured 8 MiB chunks at about
 * half the throughput of 64 MiB ones on Swift. An aborted PATCH keeps every part it finished.
 * From memory: common CDNs and proxies refuse request bodies above 100 MB, so a chunk stays below that.
 */
export const UPLOAD_CHUNK_BYTES = 64 * 1024 * 1024;
