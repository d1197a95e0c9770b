/** What the adjust-weights suite imports from the register and the scorer, in one place. */
export { decideReview, resolveMention, storeContract, type RegisterContext } from '../../../services/register/index.ts';
export { featureWeights } from '../../../resolvers/score/index.ts';
