import { ROLE_LABELS, type SessionUser } from '@gloaming/contracts';
import { useEffect, useId, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { FormMessage } from '../../../components/ui/form-message';
import { useSignOut } from '../../session/api/sign-out';
import { Initials } from '../../../components/ui/initials';

/** The signed-in person's button: opens a panel with who they are and "Sign out". */
export function UserMenu({ user }: { user: SessionUser }) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const rootRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const signOut = useSignOut();
  const navigate = useNavigate();

  useEffect(() => {
    if (!open) return;
    function onPointerDown(event: PointerEvent) {
      if (event.target instanceof Node && !rootRef.current?.contains(event.target)) setOpen(false);
    }
    function onKeyDown(event: KeyboardEvent) {
      if (event.key === 'Escape') {
        setOpen(false);
        buttonRef.current?.focus();
      }
    }
    document.addEventListener('pointerdown', onPointerDown);
    document.addEventListener('keydown', onKeyDown);
    return () => {
      document.removeEventListener('pointerdown', onPointerDown);
      document.removeEventListener('keydown', onKeyDown);
    };
  }, [open]);

  function handleSignOut() {
    signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in?signed-out=1', { replace: true }) });
  }

  return (
    <div ref={rootRef} className="relative">
      {open ? (
        <div
          id={panelId}
          className="absolute right-0 bottom-full left-0 mb-2 rounded-card bg-surface p-4 text-ink shadow-raised ring-1 ring-line"
        >
          <p className="font-semibold">{user.name}</p>
          <p className="truncate text-caption text-ink-muted">{user.email}</p>
          <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-caption">
            <dt className="text-ink-muted">Role</dt>
            <dd className="font-medium">{ROLE_LABELS[user.role]}</dd>
            <dt className="text-ink-muted">Firm</dt>
            <dd className="truncate font-medium">{user.organization.name}</dd>
          </dl>
          <div className="mt-3">
            <FormMessage tone="error">{signOut.error ? signOut.error.message : null}</FormMessage>
          </div>
          <button
            type="button"
            onClick={handleSignOut}
            disabled={signOut.isPending}
            className="mt-3 flex h-10 w-full items-center justify-center gap-2 rounded-control bg-dusk-50 font-semibold text-dusk-800 ring-1 ring-dusk-200 ring-inset hover:bg-dusk-100"
          >
            <svg viewBox="0 0 20 20" className="size-4" aria-hidden="true">
              <path
                d="M8 4H4v12h4M12 6.5 15.5 10 12 13.5M15.5 10H8"
                fill="none"
                stroke="currentColor"
                strokeWidth="1.7"
                strokeLinecap="round"
                strokeLinejoin="round"
              />
            </svg>
            {signOut.isPending ? 'Signing out…' : 'Sign out'}
          </button>
        </div>
      ) : null}
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={open ? panelId : undefined}
        onClick={() => setOpen((value) => !value)}
        className="flex w-full items-center gap-3 rounded-control px-2.5 py-2 text-left text-white hover:bg-dusk-800"
      >
        <Initials name={user.name} tone="dark" />
        <span className="min-w-0 flex-1 truncate font-medium">{user.name}</span>
        <svg
          viewBox="0 0 16 16"
          className={`size-4 text-dusk-300 transition-transform ${open ? '' : 'rotate-180'}`}
          aria-hidden="true"
        >
          <path d="m4 6 4 4 4-4" fill="none" stroke="currentColor" strokeWidth="1.75" strokeLinecap="round" />
        </svg>
      </button>
    </div>
  );
}
