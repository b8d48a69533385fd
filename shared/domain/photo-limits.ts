/** Photo upload limit; the server answers 413 with it in the message (kept apart from the zod schema so a screen can show it without loading zod). */
export const MAX_PHOTO_MB = 15;
