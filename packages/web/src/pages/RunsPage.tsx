export function RunsPage() {
  return <p>Coming in the next commit.</p>;
}
