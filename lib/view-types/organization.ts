// The organisation's settings as the owner's page shows them.
export type OrganizationSettings = {
  name: string;
  /** Whether the person who started a run may also approve it as the baseline. */
  allowSelfApproval: boolean;
  /** The joint confidence of cost and finish at which each run draws its frontier, in percent (50–95). */
  jointConfidence: number;
};
