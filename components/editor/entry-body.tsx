// A server component: the page gets plain HTML and a stylesheet, none of the editor's JavaScript.
import './prose-entry.css';

/** Shows an entry body. `html` must come from renderEntryBody (lib/rich-text/render), never from a user. */
export function EntryBody({ html }: { html: string }) {
  return <div className="prose-entry" dangerouslySetInnerHTML={{ __html: html }} />;
}
