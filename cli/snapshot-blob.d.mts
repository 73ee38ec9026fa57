/** See snapshot-blob.mjs. */
export declare const snapshotBlobName: () => string;
