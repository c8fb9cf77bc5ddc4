// Who is asking, for the order list: a signed-in member whose list lives on the server, or nobody.
import { can, type SessionUser } from '@/lib/permissions';

/** The session user the middleware put on locals (null when signed out or before accounts load one). */
export function sessionUser(locals: App.Locals): SessionUser | null {
  return (locals as { user?: SessionUser | null }).user ?? null;
}

/** A member who may keep an order list on the server; everyone else keeps it in their browser. */
export function orderListOwner(locals: App.Locals): SessionUser | null {
  const user = sessionUser(locals);
  return user && can(user, 'own_order_lists', { ownerId: user.id }) ? user : null;
}
