//! The briefing's prose: headings, the decision sentence, verdicts, method
//! text, references and cautions, rendered from minijinja templates.
//!
//! The default templates (`templates/report/*.j2`) are embedded in the
//! binary, so the report works from any folder. `--templates DIR` replaces
//! them file by file: a file `DIR/<name>.j2` with a known name replaces that
//! template; any other `.j2` file is an error (most likely a typo).
//!
//! Undefined values are strict: a template that names a value the report
//! does not provide fails with an error naming the template, the line and
//! the name, instead of printing an empty gap.

use crate::{Error, Result};
use minijinja::{AutoEscape, Environment, ErrorKind, UndefinedBehavior, Value};
use std::collections::BTreeMap;
use std::path::{Path, PathBuf};

/// Every template, with its built-in text.
const BUILTIN: [(&str, &str); 8] = [
    (
        "headings.j2",
        include_str!("../../templates/report/headings.j2"),
    ),
    (
        "decision.j2",
        include_str!("../../templates/report/decision.j2"),
    ),
    (
        "verdict.j2",
        include_str!("../../templates/report/verdict.j2"),
    ),
    (
        "datasheet.j2",
        include_str!("../../templates/report/datasheet.j2"),
    ),
    (
        "method.j2",
        include_str!("../../templates/report/method.j2"),
    ),
    (
        "references.j2",
        include_str!("../../templates/report/references.j2"),
    ),
    (
        "cautions.j2",
        include_str!("../../templates/report/cautions.j2"),
    ),
    (
        "footer.j2",
        include_str!("../../templates/report/footer.j2"),
    ),
];

/// Names of the templates a `--templates` folder may replace.
pub fn template_names() -> Vec<&'static str> {
    BUILTIN.iter().map(|(name, _)| *name).collect()
}

/// The loaded templates, ready to render.
#[derive(Debug)]
pub struct Wording {
    env: Environment<'static>,
    /// Where each template came from, for messages ("built-in" or a path).
    origins: BTreeMap<String, String>,
}

impl Wording {
    /// The built-in wording.
    pub fn builtin() -> Result<Self> {
        Self::load(None)
    }

    /// The built-in wording with every `<name>.j2` file of `dir` in place
    /// of the template of that name.
    pub fn with_overrides(dir: &Path) -> Result<Self> {
        Self::load(Some(dir))
    }

    fn load(dir: Option<&Path>) -> Result<Self> {
        let mut sources: BTreeMap<String, (String, String)> = BUILTIN
            .iter()
            .map(|(name, text)| {
                (
                    name.to_string(),
                    (text.to_string(), format!("built-in {name}")),
                )
            })
            .collect();
        if let Some(dir) = dir {
            for (name, path) in override_files(dir)? {
                let text = std::fs::read_to_string(&path)
                    .map_err(|e| Error::io(format!("reading template {}", path.display()), e))?;
                sources.insert(name, (text, path.display().to_string()));
            }
        }
        let mut env = Environment::new();
        env.set_undefined_behavior(UndefinedBehavior::Strict);
        env.set_auto_escape_callback(|_| AutoEscape::None);
        env.set_trim_blocks(true);
        env.set_lstrip_blocks(true);
        let mut origins = BTreeMap::new();
        for (name, (text, origin)) in sources {
            env.add_template_owned(name.clone(), text)
                .map_err(|e| template_error(&origin, &e))?;
            origins.insert(name, origin);
        }
        Ok(Wording { env, origins })
    }

    /// Render template `name` with `context`. An unknown value, a syntax
    /// error or a failing filter becomes [`Error::Input`] naming the
    /// template, the line and (for an unknown value) the name.
    pub fn render(&self, name: &str, context: &Value) -> Result<String> {
        let origin = self
            .origins
            .get(name)
            .cloned()
            .unwrap_or_else(|| name.to_string());
        let template = self
            .env
            .get_template(name)
            .map_err(|e| template_error(&origin, &e))?;
        template
            .render(context)
            .map_err(|e| template_error(&origin, &e))
    }
}

/// The `.j2` files of `dir`, by template name. A `.j2` file whose name is
/// not a template's is an error that lists the valid names.
fn override_files(dir: &Path) -> Result<Vec<(String, PathBuf)>> {
    let entries = std::fs::read_dir(dir)
        .map_err(|e| Error::io(format!("reading templates folder {}", dir.display()), e))?;
    let known = template_names();
    let mut found = Vec::new();
    for entry in entries {
        let entry = entry
            .map_err(|e| Error::io(format!("reading templates folder {}", dir.display()), e))?;
        let path = entry.path();
        if path.extension().and_then(|e| e.to_str()) != Some("j2") {
            continue;
        }
        let name = entry.file_name().to_string_lossy().into_owned();
        if !known.contains(&name.as_str()) {
            return Err(Error::Input(format!(
                "template {} is not one the report uses; valid names are {}",
                path.display(),
                known.join(", ")
            )));
        }
        found.push((name, path));
    }
    found.sort();
    Ok(found)
}

/// A minijinja error as a message naming the template, the line and, for an
/// unknown value, the expression that named it.
fn template_error(origin: &str, error: &minijinja::Error) -> Error {
    let line = error
        .line()
        .map_or_else(String::new, |l| format!(", line {l}"));
    let what = match error.kind() {
        ErrorKind::UndefinedError => {
            let name = error
                .template_source()
                .zip(error.range())
                .and_then(|(source, range)| source.get(range))
                .map_or_else(|| "a value".to_string(), |n| format!("`{n}`"));
            format!(
                "{name} is not a value the report provides (see the built-in \
                 templates for the values each one can use)"
            )
        }
        _ => error
            .detail()
            .map_or_else(|| error.kind().to_string(), str::to_string),
    };
    Error::Input(format!("template {origin}{line}: {what}"))
}

/// One block of rendered prose.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Block {
    /// A paragraph (consecutive lines joined with spaces).
    Paragraph(String),
    /// A bulleted item (a line starting with `- `).
    Bullet(String),
    /// A sub-heading (a line starting with `## `).
    Heading(String),
}

/// Split rendered prose into blocks: blank lines separate paragraphs, a line
/// starting with `- ` is a bullet, one starting with `## ` a sub-heading.
pub fn blocks(text: &str) -> Vec<Block> {
    let mut out = Vec::new();
    let mut paragraph: Vec<&str> = Vec::new();
    let flush = |paragraph: &mut Vec<&str>, out: &mut Vec<Block>| {
        if !paragraph.is_empty() {
            out.push(Block::Paragraph(paragraph.join(" ")));
            paragraph.clear();
        }
    };
    for line in text.lines().map(str::trim) {
        if line.is_empty() {
            flush(&mut paragraph, &mut out);
        } else if let Some(item) = line.strip_prefix("- ") {
            flush(&mut paragraph, &mut out);
            out.push(Block::Bullet(item.trim().to_string()));
        } else if let Some(title) = line.strip_prefix("## ") {
            flush(&mut paragraph, &mut out);
            out.push(Block::Heading(title.trim().to_string()));
        } else if let Some(Block::Bullet(item)) = out.last_mut().filter(|_| paragraph.is_empty()) {
            item.push(' ');
            item.push_str(line);
        } else {
            paragraph.push(line);
        }
    }
    flush(&mut paragraph, &mut out);
    out
}

/// Read `key: text` lines rendered from `headings.j2` into a map; blank
/// lines are skipped. A line without a colon is an error naming the line.
pub fn key_lines(origin: &str, text: &str) -> Result<BTreeMap<String, String>> {
    let mut map = BTreeMap::new();
    for (index, line) in text.lines().enumerate() {
        let line = line.trim();
        if line.is_empty() {
            continue;
        }
        let (key, value) = line.split_once(':').ok_or_else(|| {
            Error::Input(format!(
                "template {origin}, output line {}: expected `key: text`, found {line:?}",
                index + 1
            ))
        })?;
        map.insert(key.trim().to_string(), value.trim().to_string());
    }
    Ok(map)
}

impl Wording {
    /// Where template `name` came from ("built-in …" or its path).
    pub fn origin(&self, name: &str) -> String {
        self.origins
            .get(name)
            .cloned()
            .unwrap_or_else(|| name.to_string())
    }
}
