// The data grids' own words (filter menus, "no rows", paging) in the user's language, from the grid's
// locale package. Each grid takes them when it is made (`:locale-text="gridLocaleText()"`); the language is
// changed on the profile page, where no grid shows. The grid reads localeText only with its LocaleModule.
import { AG_GRID_LOCALE_EN, AG_GRID_LOCALE_ES } from '@ag-grid-community/locale'
import { LocaleModule, ModuleRegistry } from 'ag-grid-community'
import { i18n } from '@/i18n'

ModuleRegistry.registerModules([LocaleModule])

export const gridLocaleText = () => (i18n.global.locale.value === 'es' ? AG_GRID_LOCALE_ES : AG_GRID_LOCALE_EN)
