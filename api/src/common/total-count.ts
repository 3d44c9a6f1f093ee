import type { FastifyReply } from 'fastify';

/** One page of a list, and how many there are in all. */
export interface Page<T> {
  items: T[];
  total: number;
}

/** Sends a page's items, with the total in the X-Total-Count header. */
export function withTotalCount<T>(reply: FastifyReply, page: Page<T>): T[] {
  void reply.header('X-Total-Count', String(page.total));
  return page.items;
}
