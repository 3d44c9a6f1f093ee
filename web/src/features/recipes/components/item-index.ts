/** Names for the ids a recipe screen shows; see buildItemLookup. */
export { buildItemLookup as buildLookup } from '@/components/ui/item-lookup';
