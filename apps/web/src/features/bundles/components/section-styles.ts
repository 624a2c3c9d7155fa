/** Yield estimate and cut plan as a page section look like the page's other panels; inside a form step, like a note within the step. */
export const pageSection = 'space-y-4 rounded-stitch border-2 border-seam bg-muslin p-4 shadow-quilt sm:p-6';
export const stepSection = 'space-y-3 rounded-stitch border-2 border-seam bg-linen p-4';
