export function AdminPage() {
  return <p>Coming in the next commit.</p>;
}
