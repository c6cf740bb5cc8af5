import { useCallback } from 'react';
import { useSearchParams } from 'react-router';

/** Page and open message live in the URL (?page=2&message=…), so a message can be linked and Back works. */
export function useMailLocation() {
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Number(params.get('page')) || 1);
  const messageId = params.get('message');

  const setPage = useCallback(
    (next: number) =>
      setParams((p) => {
        p.set('page', String(next));
        p.delete('message');
        return p;
      }),
    [setParams],
  );
  const open = useCallback(
    (id: string | null) =>
      setParams((p) => {
        if (id) p.set('message', id);
        else p.delete('message');
        return p;
      }),
    [setParams],
  );
  return { page, messageId, setPage, open };
}
