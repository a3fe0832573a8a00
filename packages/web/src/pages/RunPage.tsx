export function RunPage() {
  return <p>Coming in the next commit.</p>;
}
