export function RevisionPage() {
  return <p>Coming in the next commit.</p>;
}
