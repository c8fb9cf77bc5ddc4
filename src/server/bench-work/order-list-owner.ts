// Who is asking, for the order list: a signed-in member whose list lives on the server, or nobody.
import { can, type SessionUser } from '@/lib/permissions';

/** A member who may keep an order list on the server; everyone else keeps it in their browser. */
export function orderListOwner(locals: App.Locals): SessionUser | null {
  const user = locals.user ?? null;
  return user && can(user, 'own_order_lists', { ownerId: user.id }) ? user : null;
}
