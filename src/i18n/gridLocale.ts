// The grids' own words (no rows, loading, filter menus, page controls) in the user's language, from the
// grid's published translations (@ag-grid-community/locale). Pass as :locale-text to each AgGridVue; the
// grid reads localeText only with its Locale module registered, which importing this file does.
import { AG_GRID_LOCALE_EN, AG_GRID_LOCALE_ES } from '@ag-grid-community/locale'
import { LocaleModule, ModuleRegistry } from 'ag-grid-community'
import { computed } from 'vue'
import { useI18n } from 'vue-i18n'

ModuleRegistry.registerModules([LocaleModule])

export function useGridLocale() {
  const { locale } = useI18n()
  return computed<Record<string, string>>(() => (locale.value === 'es' ? AG_GRID_LOCALE_ES : AG_GRID_LOCALE_EN))
}
