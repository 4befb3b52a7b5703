// The batch shelf's other side: the batches taken off it, listed at `/batches?off=1`.
export const OFF_SHELF_PATH = '/batches?off=1';

export const offShelfOf = (params: URLSearchParams) => params.get('off') === '1';
