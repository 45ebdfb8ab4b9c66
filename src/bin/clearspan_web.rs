//! The browser entry point: mounts the clearspan app into the page body.

fn main() {
    clearspan::web::start();
}
