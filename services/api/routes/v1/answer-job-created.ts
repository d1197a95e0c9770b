/** The Idempotency-Key answer of a job submission. */
import { type JobCreatedHook } from '../../../jobs/submit-ingest.ts';
import { storeIdempotentAnswer } from '../../auth/idempotency.ts';
import { jobView } from './job-view.ts';

/**
 * A job submission's Idempotency-Key answer, stored in the transaction that creates the job: a retry whose first
 * answer was lost (the process stopped while the upload was read, or before it answered) is answered with the same
 * job, never a second one. The answer stored once the submission is done replaces it with the job as it then is.
 */
export function answerJobCreated(claim: { keyId: string; key: string }): JobCreatedHook {
  return async (trx, jobId) =>
    storeIdempotentAnswer(trx, claim, {
      statusCode: 202,
      contentType: 'application/json; charset=utf-8',
      headers: { location: `/v1/jobs/${jobId}` },
      body: JSON.stringify(await jobView(trx, jobId)),
    });
}
