import { useState, type CSSProperties, type FormEvent } from 'react';
import { Navigate, useLocation, useNavigate } from 'react-router-dom';
import { BrandMark } from '../../components/brand-mark';
import { paths } from '../../config/paths';
import { ApiError } from '../../lib/api-client';
import { useAuth } from '../../lib/auth';
import { palette } from '../theme';

// The first page anyone loads: plain elements in our theme's colors, so it ships without the heavier antd pieces.
const field: CSSProperties = { display: 'block', width: '100%', boxSizing: 'border-box', padding: '8px 11px', fontSize: 15, border: `1px solid ${palette.slate200}`, borderRadius: 4, font: 'inherit' };
const label: CSSProperties = { display: 'block', fontSize: 14, margin: '16px 0 6px', color: palette.slate800 };

export function SignInPage() {
  const { user, signIn } = useAuth();
  const navigate = useNavigate();
  const location = useLocation();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');

  if (user) return <Navigate to={paths.home} replace />;

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    if (!email.trim() || !password) {
      setError(!email.trim() ? 'Enter your e-mail' : 'Enter your password');
      return;
    }
    setBusy(true);
    setError(null);
    try {
      await signIn({ email: email.trim(), password });
      navigate((location.state as { from?: string } | null)?.from ?? paths.home, { replace: true });
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'Could not reach the server');
    } finally {
      setBusy(false);
    }
  };

  return (
    <div style={{ minHeight: '100vh', display: 'grid', placeItems: 'center', background: palette.slate900, padding: 16, boxSizing: 'border-box' }}>
      <main style={{ width: '100%', maxWidth: 380, background: '#fff', borderRadius: 8, padding: 24, boxSizing: 'border-box' }}>
        <div style={{ display: 'flex', alignItems: 'center', gap: 10, marginBottom: 8 }}>
          <BrandMark size={36} />
          <h1 style={{ margin: 0, fontSize: 24, fontWeight: 600, color: palette.slate900 }}>Amberline</h1>
        </div>
        <p style={{ color: palette.slate600, margin: '0 0 8px' }}>The move desk for oversize and overweight loads.</p>
        {error && (
          <div role="alert" data-testid="sign-in-error" style={{ margin: '12px 0', padding: '8px 12px', border: '1px solid #fca5a5', background: '#fef2f2', color: palette.danger, borderRadius: 4 }}>
            {error}
          </div>
        )}
        <form onSubmit={onSubmit} noValidate>
          <label style={label} htmlFor="sign-in-email">
            E-mail
          </label>
          <input id="sign-in-email" style={field} type="email" autoComplete="username" autoFocus value={email} onChange={(e) => setEmail(e.target.value)} />
          <label style={label} htmlFor="sign-in-password">
            Password
          </label>
          <input id="sign-in-password" style={field} type="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} />
          <button
            type="submit"
            disabled={busy}
            style={{ marginTop: 24, width: '100%', padding: '9px 0', fontSize: 15, font: 'inherit', fontWeight: 600, color: '#fff', background: busy ? '#f59e0b' : palette.amber, border: 0, borderRadius: 4, cursor: busy ? 'wait' : 'pointer' }}
          >
            {busy ? 'Signing in…' : 'Sign in'}
          </button>
        </form>
      </main>
    </div>
  );
}
