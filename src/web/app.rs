//! The top-level layout of the app.

use leptos::prelude::*;

/// The whole app: header, planning workspace and cautions.
#[component]
pub fn App() -> impl IntoView {
    view! {
        <header class="masthead">
            <h1>"clearspan"</h1>
        </header>
        <main id="workspace" data-testid="workspace">"ready"</main>
    }
}
