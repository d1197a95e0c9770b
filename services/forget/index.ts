export { forgetCounterparty, type ForgetOptions, type ForgetResult } from './forget.ts';
