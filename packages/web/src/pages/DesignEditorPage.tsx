export function DesignEditorPage() {
  return <p>Coming in the next commit.</p>;
}
