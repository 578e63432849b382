import { ref } from 'vue'
import type { VendorView, WarehouseChoice } from '@shared/schemas/purchasingViews'
import { purchasingApi } from '@/api/purchasing'

/** Vendors and ship-to warehouses for the purchasing forms, loaded once per form. */
export function usePurchasingChoices() {
  const vendors = ref<VendorView[]>([])
  const warehouses = ref<WarehouseChoice[]>([])
  async function load(): Promise<void> {
    const [v, w] = await Promise.all([purchasingApi.vendors(), purchasingApi.warehouses()])
    vendors.value = v.filter((x) => x.active)
    warehouses.value = w
  }
  return { vendors, warehouses, load }
}
