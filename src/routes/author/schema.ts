import { z } from 'zod';
import { ITEM_STATUSES } from '$lib/server/db/schema/item';
import { KINDS } from '$lib/items/types';
import { AREAS } from '$lib/items/blueprint';

const areaIds = AREAS.map((a) => a.id) as [string, ...string[]];

/** Filters of the author's list; anything unknown is ignored rather than refused. */
export const listFilterSchema = z.object({
	status: z.enum(ITEM_STATUSES).optional().catch(undefined),
	area: z.enum(areaIds).optional().catch(undefined),
	kind: z.enum(KINDS).optional().catch(undefined)
});
