/**
 * Message areas the sign-in page and the shell need before anything is shown. The build puts them in one
 * chunk per language and every other area in a second one (vite.config.ts), so a signed-in page's words
 * arrive in two requests per language instead of one per area.
 */
export const BOOT_AREAS = ['common', 'shell', 'auth', 'errors'] as const
