//! The clearspan command-line program. Its code is native only (see
//! `native.rs`): the argument parser is not a dependency of the wasm build,
//! where this binary is an empty stub so that `--bins` still builds there.

#[cfg(not(target_arch = "wasm32"))]
mod native;

#[cfg(not(target_arch = "wasm32"))]
fn main() -> std::process::ExitCode {
    native::main()
}

#[cfg(target_arch = "wasm32")]
fn main() {}
