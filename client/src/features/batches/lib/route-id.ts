import { data } from 'react-router';

/** The :id of a batch or case route; anything but a positive whole number is a page that does not exist. */
export function routeIdOf(raw: string | undefined): number {
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0 || id > 2_147_483_647) throw data(null, { status: 404 });
  return id;
}
