/** One (board revision, firmware family) pair: values from different families are never mixed. */
export type GroupKey = { boardRevisionId: number; firmwareFamilyId: number };
