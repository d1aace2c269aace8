// The photo viewer: links to a photo's large rendition open it full screen with zoom (pinch,
// double-tap, wheel, buttons), swipe and arrow keys between the photos of one gallery, Escape to
// close, focus kept inside while open and returned to the link afterwards. PhotoSwipe does the
// viewing (a well-kept MIT library, no CDN, no inline scripts; it sets style attributes, which our
// CSP allows); it is loaded on the first open, so pages carry none of its weight until then.
// Without JavaScript the links simply open the large photo.
//
//   <div use:lightbox> <a href={large} data-lightbox data-width={w} data-height={h}><img alt=…></a> … </div>
//
// A page that shows one photo at a time passes the whole set instead, and its link says which
// photo it shows: <div use:lightbox={photos}> <a href=… data-lightbox data-index={shown}>…</a> </div>

type PhotoSwipeModule = typeof import('photoswipe');
let loading: Promise<PhotoSwipeModule> | null = null;

function load(): Promise<PhotoSwipeModule> {
	loading ??= Promise.all([import('photoswipe'), import('photoswipe/style.css')]).then(([module]) => module);
	return loading;
}

/** The gallery's items from its links, in page order. */
function itemsOf(links: HTMLAnchorElement[]) {
	return links.map((a) => {
		const img = a.querySelector('img');
		return {
			src: a.href,
			width: Number(a.dataset.width) || img?.naturalWidth || 1200,
			height: Number(a.dataset.height) || img?.naturalHeight || 800,
			alt: img?.alt ?? '',
			msrc: img?.currentSrc || undefined,
			element: a
		};
	});
}

/** A photo of a gallery given as a list. */
export interface LightboxPhoto {
	src: string;
	width: number;
	height: number;
	alt: string;
}

export function lightbox(node: HTMLElement, photos?: LightboxPhoto[]) {
	let given = photos;
	const onClick = (event: MouseEvent) => {
		if (event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
		const link = (event.target as Element | null)?.closest<HTMLAnchorElement>('a[data-lightbox]');
		if (!link || !node.contains(link)) return;
		event.preventDefault();
		const links = [...node.querySelectorAll<HTMLAnchorElement>('a[data-lightbox]')];
		const dataSource = given?.length ? given.map((p) => ({ ...p, element: link })) : itemsOf(links);
		const index = given?.length ? Number(link.dataset.index) || 0 : Math.max(0, links.indexOf(link));
		void load().then(({ default: PhotoSwipe }) => {
			const viewer = new PhotoSwipe({
				dataSource,
				index,
				initialZoomLevel: 'fit',
				secondaryZoomLevel: 2,
				maxZoomLevel: 4,
				wheelToZoom: true,
				bgOpacity: 0.92,
				showHideAnimationType: 'fade',
				closeTitle: 'Close (Esc)',
				zoomTitle: 'Zoom in or out (or double-tap)',
				arrowPrevTitle: 'Previous photo (left arrow)',
				arrowNextTitle: 'Next photo (right arrow)',
				errorMsg: 'This photo could not be loaded.',
				indexIndicatorSep: ' of '
			});
			viewer.init();
		});
	};
	node.addEventListener('click', onClick);
	return {
		update: (next?: LightboxPhoto[]) => (given = next),
		destroy: () => node.removeEventListener('click', onClick)
	};
}
