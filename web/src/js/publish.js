// Publishing a link: a page served by the edge service carries <meta name="gibbsheet-service"
// content="/v1/worksheets">; there, and only there, the page offers to store the worksheet on the
// service and shows the link the service answers with. A page opened as a file has no marker (and its
// security policy forbids every connection), so it offers nothing.

import { store } from "./state.js";

// servicePath is the path the worksheet is posted to, or "" when the page was not served by the service.
function servicePath() {
  const marker = document.querySelector('meta[name="gibbsheet-service"]');
  if (!marker || !/^https?:$/.test(location.protocol)) return "";
  const path = marker.getAttribute("content") || "";
  return path.startsWith("/") ? path : "";
}

function show(box, kind, text, url) {
  box.hidden = false;
  box.className = "publish-msg " + kind;
  box.replaceChildren(document.createTextNode(text));
  if (url) {
    const link = document.createElement("input");
    link.id = "publish-link";
    link.readOnly = true;
    link.value = url;
    link.size = Math.min(60, url.length + 2);
    link.setAttribute("aria-label", "Link to the published worksheet");
    link.addEventListener("focus", () => link.select());
    box.append(" ", link);
  }
}

// publish posts the open worksheet and shows its link; the service keeps every document under an id
// derived from its content, so publishing the same worksheet twice gives the same link.
async function publish(path, button, box) {
  button.disabled = true;
  show(box, "busy", "Publishing…");
  try {
    const answer = await fetch(path, {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify(store.doc),
    });
    const body = await answer.json().catch(() => ({}));
    if (!answer.ok) {
      show(box, "err", `The service did not publish the worksheet: ${body.error || answer.statusText} (${answer.status}).`);
      return;
    }
    show(box, "ok", "Published. Anyone with this link sees this version of the worksheet:", body.url);
  } catch (e) {
    show(box, "err", "The service could not be reached: " + (e.message || e));
  } finally {
    button.disabled = false;
  }
}

// setupPublish adds the publish button next to the file buttons when the service served the page.
export function setupPublish() {
  const path = servicePath();
  if (!path) return;
  const bar = document.querySelector(".file-bar") || document.querySelector(".band-tools");
  if (!bar) return;
  const button = document.createElement("button");
  button.type = "button";
  button.id = "publish";
  button.textContent = "Publish a link";
  button.title = "Store this worksheet on the service and get a link to it";
  const box = document.createElement("p");
  box.id = "publish-msg";
  box.setAttribute("role", "status");
  box.hidden = true;
  bar.append(button);
  bar.after(box);
  button.addEventListener("click", () => publish(path, button, box));
}
