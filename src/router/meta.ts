import 'vue-router'
import type { Area, Role } from '@shared/roles'

declare module 'vue-router' {
  interface RouteMeta {
    /** Open to signed-out visitors (the sign-in page only). */
    public?: boolean
    /** The navigation area the page belongs to. */
    area?: Area
    /** Roles that may open the page; absent means any signed-in user. */
    roles?: readonly Role[]
    /** Title key in the i18n messages. */
    title?: string
    /** Full-screen page without the shell (handheld screens). */
    bare?: boolean
    /**
     * A screen the warehouse crew use with gloves on a phone or tablet: at those widths every control is at
     * least 44 × 44 px with 8 px between targets (theme.css, `.ly-touch`).
     */
    touch?: boolean
  }
}
