export { backupEmbedded, restoreEmbedded, BackupError, PG_DUMP_HINT, type BackupResult, type RestoreResult } from './backup.ts';
