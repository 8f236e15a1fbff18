// A table's search, sort and page kept in the address bar, so reload and back keep the view.
import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';

export interface ListParams<S extends string> {
  q: string;
  sort: S;
  order: 'asc' | 'desc';
  cursor: string | undefined;
  /** Cursors of the pages before this one, for "Previous". */
  trail: string[];
}

/** A list's parameters as the address bar holds them (also read by route loaders, before the screen renders). */
export function readListParams<S extends string>(sp: URLSearchParams, defaultSort: S): ListParams<S> {
  return {
    q: sp.get('q') ?? '',
    sort: (sp.get('sort') as S | null) ?? defaultSort,
    order: sp.get('order') === 'desc' ? 'desc' : 'asc',
    cursor: sp.get('cursor') ?? undefined,
    trail: sp.get('trail') ? sp.get('trail')!.split(',') : [],
  };
}

/** A screen's own filters from the address bar ('' when absent). */
export function readListExtras(sp: URLSearchParams, extraKeys: readonly string[]): Record<string, string> {
  return Object.fromEntries(extraKeys.map((k) => [k, sp.get(k) ?? '']));
}

export function useListParams<S extends string>(defaultSort: S, extraKeys: readonly string[] = []) {
  const [sp, setSp] = useSearchParams();
  const params = useMemo(() => readListParams(sp, defaultSort), [sp, defaultSort]);
  const extras = useMemo(() => readListExtras(sp, extraKeys), [sp, extraKeys]);

  const update = useCallback(
    (changes: Record<string, string | undefined>, resetPage = true) => {
      setSp(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [k, v] of Object.entries(changes)) {
            if (v === undefined || v === '') next.delete(k);
            else next.set(k, v);
          }
          if (resetPage) {
            next.delete('cursor');
            next.delete('trail');
          }
          return next;
        },
        { replace: true },
      );
    },
    [setSp],
  );

  return {
    params,
    extras,
    setSearch: (q: string) => update({ q }),
    setFilter: (key: string, value: string) => update({ [key]: value }),
    setSort: (sort: S, order: 'asc' | 'desc') => update({ sort, order }),
    toggleSort: (sort: S) => update({ sort, order: params.sort === sort && params.order === 'asc' ? 'desc' : 'asc' }),
    nextPage: (cursor: string) => update({ cursor, trail: [...params.trail, params.cursor ?? ''].join(',') }, false),
    prevPage: () => {
      const trail = [...params.trail];
      const prev = trail.pop();
      update({ cursor: prev || undefined, trail: trail.length ? trail.join(',') : undefined }, false);
    },
  };
}

/**
 * The props every paged list screen passes to DataTable from its list parameters and query result:
 * rows, states, search, sort and paging.
 */
export function pagedTableProps<T, S extends string>(
  list: ReturnType<typeof useListParams<S>>,
  result: { data?: { items: T[]; nextCursor: string | null }; isLoading: boolean; error: unknown; refetch: () => unknown },
) {
  const { params } = list;
  return {
    rows: result.data?.items,
    isLoading: result.isLoading,
    error: result.error,
    onRetry: () => void result.refetch(),
    search: params.q,
    onSearch: list.setSearch,
    sort: params.sort,
    order: params.order,
    onSort: list.toggleSort,
    onSortSet: list.setSort,
    hasPrev: !!params.cursor,
    hasNext: !!result.data?.nextCursor,
    onPrev: list.prevPage,
    onNext: () => {
      if (result.data?.nextCursor) list.nextPage(result.data.nextCursor);
    },
  };
}
