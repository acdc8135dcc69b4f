// The largest file the server takes (songs, tunings to import), and how both sides word it.

export const uploadLimitBytes = 5 * 1024 * 1024;
export const uploadLimitText = '5 MB';

/** The refusal of a file over the limit, as the field fault both sides show. */
export const uploadTooLarge = `file: larger than the limit of ${uploadLimitText}.`;
