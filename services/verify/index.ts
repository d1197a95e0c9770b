export { verifyRegister, formatVerifyReport, type VerifyReport, type VerifyOptions, type CheckReport } from './verify.ts';
export { INVARIANT_CHECKS, type Violation, type Check } from './invariants.ts';
export { checkReplay, compareSnapshots } from './replay-check.ts';
