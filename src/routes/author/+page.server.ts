import type { PageServerLoad } from './$types';
import { requireRole } from '$lib/server/auth/guards';
import { listMyItems } from '$lib/server/content/authoring';
import { ITEM_STATUSES } from '$lib/server/db/schema/item';
import { KINDS } from '$lib/items/types';
import { AREAS } from '$lib/items/blueprint';
import { listFilterSchema } from './schema';

export const load: PageServerLoad = async (event) => {
	const me = requireRole(event, 'author');
	const q = event.url.searchParams;
	const filters = listFilterSchema.parse({ status: q.get('status') || undefined, area: q.get('area') || undefined, kind: q.get('kind') || undefined });
	const items = await listMyItems(me, filters);
	return {
		items,
		filters,
		options: { statuses: [...ITEM_STATUSES], areas: AREAS.map((a) => ({ id: a.id, title: a.title })), kinds: [...KINDS] }
	};
};
