import type { SubmitFunction } from '@sveltejs/kit';

/** A `use:enhance` submit function that reports while the form is on its way, to disable its button. */
export function trackBusy(setBusy: (busy: boolean) => void): SubmitFunction {
	return () => {
		setBusy(true);
		return async ({ update }) => {
			await update();
			setBusy(false);
		};
	};
}
