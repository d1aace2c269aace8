import type { ParamMatcher } from '@sveltejs/kit';
import { isRenditionSize } from '$lib/media/urls';

export const match = ((param: string) => isRenditionSize(param)) satisfies ParamMatcher;
