/**
 * The only module that calls `fetch`. Calculations go to `POST /api/v1/<endpoint>`;
 * when the server is out of reach the service worker answers them from the device.
 */

const API_ROOT = "/api/v1/";

/**
 * Run one calculation. Resolves to `{status, body}`; `status` 0 means that neither the
 * server nor a service worker answered. Rejects only when aborted through `signal`.
 * `purpose` ("result" or "chart") is sent as a header so logs and tests can tell
 * a screen's main result from chart points.
 */
export async function calculate(endpoint, body, { signal, purpose = "result" } = {}) {
  let response;
  try {
    response = await fetch(API_ROOT + endpoint, {
      method: "POST",
      headers: { "Content-Type": "application/json", "X-Webcalc-Purpose": purpose },
      body: JSON.stringify(body),
      signal,
    });
  } catch (err) {
    if (err && err.name === "AbortError") throw err;
    return { status: 0, body: null };
  }
  let data = null;
  try {
    data = await response.json();
  } catch {
    data = null;
  }
  return { status: response.status, body: data };
}

/** GET a JSON file (generated tables, catalogs); `null` when missing or unreadable. */
export async function getJSON(path) {
  try {
    const response = await fetch(path);
    if (!response.ok) return null;
    return await response.json();
  } catch {
    return null;
  }
}
