//! Pieces of the data tables the views draw with leptos (the plan sheet's
//! tasks): one header row of column heads. Tables written as HTML text use
//! `markup::html::Html::column_heads`.

use leptos::prelude::*;

/// A table's head: one row of column headers, each scoped to its column
/// for screen readers.
pub fn column_heads(names: &'static [&'static str]) -> impl IntoView {
    view! {
        <thead>
            <tr>{names.iter().map(|name| view! { <th scope="col">{*name}</th> }).collect_view()}</tr>
        </thead>
    }
}
