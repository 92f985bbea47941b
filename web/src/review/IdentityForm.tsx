import { useState } from 'react';
import { REVIEW_ROLES, type ReviewAuthor } from '@linewright/core';
import { saveAuthor, useReviewView } from './reviewState';

/** Name and role, asked once per browser and kept there (nothing is sent anywhere). */
export function IdentityForm({ onDone }: { onDone?: () => void }) {
  const current = useReviewView((v) => v.author);
  const [name, setName] = useState(current?.name ?? '');
  const [role, setRole] = useState<ReviewAuthor['role']>(current?.role ?? 'reviewer');
  const trimmed = name.trim();
  return (
    <form
      className="lw-rv-identity"
      onSubmit={(e) => {
        e.preventDefault();
        if (trimmed === '') return;
        saveAuthor({ name: trimmed.slice(0, 80), role });
        onDone?.();
      }}
    >
      <p className="lw-muted">Who is writing? Kept in this browser and stored with each comment; nothing is sent anywhere.</p>
      <label className="lw-field">
        <span>Name</span>
        <input value={name} maxLength={80} onChange={(e) => setName(e.target.value)} data-testid="review-identity-name" />
      </label>
      <label className="lw-field">
        <span>Role</span>
        <select value={role} onChange={(e) => setRole(e.target.value as ReviewAuthor['role'])} data-testid="review-identity-role">
          {REVIEW_ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
        </select>
      </label>
      <button type="submit" disabled={trimmed === ''} data-testid="review-identity-save">Use this name</button>
    </form>
  );
}
