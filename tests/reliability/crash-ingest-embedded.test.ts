// Crash safety of batch ingest on the embedded database: see crash-ingest-suite.ts for what is checked and the sizes.
import { crashIngestSuite } from './crash-ingest-suite.ts';

crashIngestSuite('pglite');
