// What the parts screens ask for, said once: the pages' hooks and the routes' prefetch use the same queries.
import type { Params } from 'react-router-dom';
import { can, type Role } from '@bumperline/contracts/roles';
import type { FetchAhead } from '../../api/fetch-ahead.ts';
import { partListQuery, partQuery } from '../../api/parts-catalogue.ts';
import { readListExtras, readListParams } from '../../components/use-list-params.ts';
import type { CatalogueListQuery } from '@bumperline/contracts/parts-catalogue';

export type PartSort = 'partNumber' | 'description';

/** The list query the parts screen sends for the address bar's search, sort, kind and page. */
export function partsListQuery(sp: URLSearchParams): CatalogueListQuery {
  const p = readListParams<PartSort>(sp, 'partNumber');
  const extras = readListExtras(sp, ['kind', 'retired']);
  return {
    q: p.q || undefined,
    sort: p.sort,
    order: p.order,
    cursor: p.cursor,
    limit: 25,
    kind: (extras.kind || undefined) as CatalogueListQuery['kind'],
    includeRetired: extras.retired === 'yes' ? 'true' : undefined,
  };
}

export function prefetchParts(ahead: FetchAhead, role: Role, url: URL) {
  if (can(role, 'stock:read')) ahead(partListQuery(partsListQuery(url.searchParams)));
}

export function prefetchPart(ahead: FetchAhead, role: Role, _url: URL, params: Params) {
  if (can(role, 'stock:read') && params.id) ahead(partQuery(params.id));
}
