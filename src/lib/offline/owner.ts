/**
 * Whose booth cache is on this tablet (a painter's user id), in localStorage: read synchronously at start-up, so the
 * app knows whether to load the offline code and restore the cache before the first screen. Kept apart from the
 * cache code so every other user's first download stays without it.
 */
export const OWNER_KEY = "coatwright-offline-user";
export const cachedUserId = () => localStorage.getItem(OWNER_KEY);
