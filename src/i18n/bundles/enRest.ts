// Every other message area in one chunk: a signed-in page's words arrive in one request, not one per area.
import { byArea, type Messages } from '../messageFiles'

export default byArea(import.meta.glob<{ default: Messages }>(['../en/*.ts', '!../en/{common,shell,auth,errors}.ts'], { eager: true }))
