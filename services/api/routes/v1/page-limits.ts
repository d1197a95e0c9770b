/** Limits the /v1 routes share: the longest reason kept in the history, page sizes. */

export const MAX_REASON = 2000;
export const MAX_PAGE = 500;
export const DEFAULT_PAGE = 50;
