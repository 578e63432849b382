// The sign-in page's and the shell's message areas in one chunk (BOOT_AREAS, ../bootAreas.ts).
import { byArea, type Messages } from '../messageFiles'

export default byArea(import.meta.glob<{ default: Messages }>('../en/{common,shell,auth,errors}.ts', { eager: true }))
