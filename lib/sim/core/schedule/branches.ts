/**
 * Probabilistic branches: an activity with "existence": p happens in an iteration when its own
 * uniform u exceeds 1 − p (as a risk occurs), so a correlation can make branches and risks happen
 * together. The uniform's name is its random stream's label and its name in correlations.
 */
export const existenceInput = (activityId: string) => `${activityId} (existence)`;
