export function DesignsPage() {
  return <p>Coming in the next commit.</p>;
}
