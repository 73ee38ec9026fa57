import { machine } from 'node:os';

/**
 * The file name in cli/dist/ of the start-up snapshot made by, and only
 * startable on, the node running this. cli/bin/dubito spells the same name
 * from `node --version` and `uname -m`, without starting node.
 */
export const snapshotBlobName = () => `dubito-${process.version}-${machine()}.blob`;
