import { useState } from 'react';
import { Link, NavLink } from 'react-router-dom';
import { LogOut, Menu, UserRound, X } from 'lucide-react';
import { Button } from '../../components/ui/button';
import { LogoMark } from '../../components/ui/logo-mark';
import { useSession } from '../../features/auth/api/get-session';
import { useSignOut } from '../../features/auth/api/sign-out';
import { NoticesIndicator } from '../../features/notices/components/notices-indicator';

const navLink = ({ isActive }: { isActive: boolean }) =>
  'inline-flex min-h-12 items-center rounded-lg px-4 text-lg font-semibold hover:bg-white/15 ' +
  (isActive ? 'underline decoration-mark decoration-4 underline-offset-8' : '');

/**
 * Brand, the main places and the signed-in person. Below 640 px the places and the person fold behind a
 * Menu button; from tablet width up everything is in one row.
 */
export function AppHeader() {
  const session = useSession();
  const signOut = useSignOut();
  const [menuOpen, setMenuOpen] = useState(false);
  const user = session.data?.user ?? null;

  return (
    <header className="bg-ink text-white">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2 sm:px-6">
        <Link to={user ? '/hulls' : '/sign-in'} className="flex min-h-12 items-center gap-3 rounded-lg pr-2 text-xl font-bold tracking-tight">
          <LogoMark />
          Loftbench
        </Link>

        {user && (
          <>
            <button
              type="button"
              className="ml-auto inline-flex min-h-12 min-w-12 items-center justify-center gap-2 rounded-lg border-2 border-white/80 px-3 font-semibold sm:hidden"
              aria-expanded={menuOpen}
              aria-controls="main-menu"
              onClick={() => setMenuOpen((open) => !open)}
            >
              {menuOpen ? <X aria-hidden="true" className="size-6" /> : <Menu aria-hidden="true" className="size-6" />}
              Menu
            </button>

            <div
              id="main-menu"
              className={`${menuOpen ? 'flex' : 'hidden'} w-full flex-col gap-3 pb-3 sm:flex sm:w-auto sm:flex-1 sm:flex-row sm:items-center sm:pb-0`}
            >
              <nav aria-label="Main">
                <ul className="flex flex-col gap-1 sm:flex-row">
                  <li>
                    <NavLink to="/hulls" className={navLink} onClick={() => setMenuOpen(false)}>
                      Hulls
                    </NavLink>
                  </li>
                  <li>
                    <NavLink to="/library" className={navLink} onClick={() => setMenuOpen(false)}>
                      Library
                    </NavLink>
                  </li>
                  <li>
                    <NoticesIndicator onNavigate={() => setMenuOpen(false)} />
                  </li>
                </ul>
              </nav>
              <div className="flex flex-wrap items-center gap-3 sm:ml-auto">
                <NavLink to="/account" title="Your account" className="flex min-h-12 items-center gap-2 rounded-lg px-2 text-white/90 hover:bg-white/15" onClick={() => setMenuOpen(false)}>
                  <UserRound aria-hidden="true" className="size-5" />
                  <span className="max-w-48 truncate">{user.displayName}</span>
                </NavLink>
                <Button variant="on-dark" busy={signOut.isPending} onClick={() => signOut.mutate()}>
                  <LogOut aria-hidden="true" className="size-5" />
                  Sign out
                </Button>
                {signOut.isError && (
                  <span role="alert" className="font-medium text-mark">
                    Could not sign out. Try again.
                  </span>
                )}
              </div>
            </div>
          </>
        )}
      </div>
    </header>
  );
}
