// The data grids' own words (filter menus, "no rows", paging) in the user's language, from the grid's
// locale package. Each grid takes them when it is made (`:locale-text="gridLocaleText()"`); the language is
// changed on the profile page, where no grid shows.
import { AG_GRID_LOCALE_EN, AG_GRID_LOCALE_ES } from '@ag-grid-community/locale'
import { i18n } from '@/i18n'

export const gridLocaleText = () => (i18n.global.locale.value === 'es' ? AG_GRID_LOCALE_ES : AG_GRID_LOCALE_EN)
