//! Loading a scenario file: read, parse with spans, build the typed
//! scenario, validate, and keep what the report needs (defaults applied,
//! inputs as given, file hash).

use super::candidate_reader::read_candidates;
use super::context::{locate, AppliedDefault, Context, InputLine};
use super::correlation::read_correlations;
use super::economics::read_economics;
use super::error::ScenarioError;
use super::fuel::read_fuel;
use super::operation::read_operation;
use super::reader::TableReader;
use super::scenario_table::read_meta;
use super::site::read_site;
use super::tree::{line_column, parse_document, Node, NodeValue};
use super::types::Scenario;
use super::uncertainty_section::read_uncertainty;
use super::validate::{check_ranges, cross_check};
use chrono::Datelike;
use sha2::{Digest, Sha256};
use std::collections::BTreeMap;
use std::ops::Range;
use std::path::Path;

/// A scenario as loaded from a file, with what the report's assumptions
/// page and later error messages need.
#[derive(Debug, Clone)]
pub struct LoadedScenario {
    /// The typed, validated scenario.
    pub scenario: Scenario,
    /// File label used in messages (the path as the user gave it).
    pub file_label: String,
    /// The file text as read.
    pub source_text: String,
    /// SHA-256 of the file bytes, lower-case hex.
    pub sha256_hex: String,
    /// Every default the loader filled in, in file order.
    pub applied_defaults: Vec<AppliedDefault>,
    /// Every input as written, in file order.
    pub inputs: Vec<InputLine>,
    spans: BTreeMap<String, Range<usize>>,
}

const SECTIONS: &[&str] = &[
    "scenario",
    "site",
    "fuel",
    "economics",
    "operation",
    "candidate",
    "uncertainty",
    "correlation",
];

/// Read and load the scenario file at `path`.
pub fn load(path: &Path) -> Result<LoadedScenario, ScenarioError> {
    let label = path.display().to_string();
    let bytes = std::fs::read(path).map_err(|source| ScenarioError::Read {
        file: label.clone(),
        source,
    })?;
    let text = utf8_text(bytes, &label)?;
    parse_in(&text, &label, path.parent())
}

/// The file's bytes as text; a file that is not UTF-8 is bad input, placed
/// at the line, column and byte offset of its first bad byte.
pub(crate) fn utf8_text(bytes: Vec<u8>, label: &str) -> Result<String, ScenarioError> {
    String::from_utf8(bytes).map_err(|e| {
        let offset = e.utf8_error().valid_up_to();
        let bytes = e.as_bytes();
        let valid = std::str::from_utf8(&bytes[..offset]).unwrap_or_default();
        let (line, column) = line_column(valid, offset);
        ScenarioError::At {
            file: label.to_string(),
            line,
            column,
            field: "file encoding".to_string(),
            problem: format!(
                "byte {offset} (0x{:02X}) is not UTF-8 text",
                bytes.get(offset).copied().unwrap_or_default()
            ),
            valid: "expected a text file saved as UTF-8 (plain ASCII is UTF-8)".to_string(),
        }
    })
}

/// Load a scenario from its text; `file_label` names it in messages.
pub fn parse(text: &str, file_label: &str) -> Result<LoadedScenario, ScenarioError> {
    parse_in(text, file_label, None)
}

/// Load a scenario from its text; `file_label` names it in messages and
/// `dir` is the folder files it names (weather, profile) are relative to
/// (`None`: the working folder).
pub fn parse_in(
    text: &str,
    file_label: &str,
    dir: Option<&Path>,
) -> Result<LoadedScenario, ScenarioError> {
    let mut ctx = Context::new(file_label, text);
    ctx.dir = dir.map(Path::to_path_buf);
    let entries = parse_document(text).map_err(|e| {
        ctx.error_at_offset(
            e.offset,
            "TOML syntax",
            e.message,
            "expected valid TOML (key = value lines, [section] headers, quoted strings)",
        )
    })?;
    let root = Node {
        span: 0..0,
        value: NodeValue::Table(entries),
    };
    let r = TableReader::new(&mut ctx, "", &root, SECTIONS)?;
    let section = |name: &str| r.entry(name).map(|e| &e.node);
    let required = |ctx: &Context, name: &str| {
        section(name).ok_or_else(|| {
            ctx.error_at_offset(
                0,
                name,
                format!("the [{name}] section is missing"),
                "expected the sections [scenario], [site], [fuel], [economics], [operation] and [[candidate]]",
            )
        })
    };
    let node = required(&ctx, "scenario")?;
    let meta = read_meta(&mut ctx, node)?;
    let empty_site = Node {
        span: 0..0,
        value: NodeValue::Table(Vec::new()),
    };
    let site = read_site(&mut ctx, section("site").unwrap_or(&empty_site))?;
    let node = required(&ctx, "economics")?;
    let economics = read_economics(&mut ctx, node)?;
    let node = required(&ctx, "fuel")?;
    let fuel = read_fuel(&mut ctx, node, economics.commercial_operation.year())?;
    let node = required(&ctx, "operation")?;
    let operation = read_operation(&mut ctx, node, site.weather.as_deref())?;
    let candidates = read_candidates(
        &mut ctx,
        section("candidate"),
        economics.commercial_operation,
        &fuel,
    )?;
    let mut scenario = Scenario {
        meta,
        site,
        fuel,
        economics,
        operation,
        candidates,
        uncertainty: Vec::new(),
        correlation: Vec::new(),
    };
    check_ranges(&scenario)
        .and_then(|()| cross_check(&scenario))
        .map_err(|v| ctx.error_for(&v.field, v.problem, v.valid))?;
    scenario.uncertainty = read_uncertainty(&mut ctx, section("uncertainty"), &scenario)?;
    scenario.correlation =
        read_correlations(&mut ctx, section("correlation"), &scenario.uncertainty)?;
    Ok(LoadedScenario {
        scenario,
        file_label: file_label.to_string(),
        source_text: text.to_string(),
        sha256_hex: sha256_hex(text.as_bytes()),
        applied_defaults: ctx.defaults,
        inputs: ctx.inputs,
        spans: ctx.spans,
    })
}

fn sha256_hex(bytes: &[u8]) -> String {
    Sha256::digest(bytes)
        .iter()
        .map(|b| format!("{b:02x}"))
        .collect()
}

impl LoadedScenario {
    /// A bad-input error placed at `key_path` in the file:
    /// `<file>:<line>:<column>: <key_path>: <message>`. Later layers use it
    /// when a value is refused after loading (e.g. the cycle solver refuses
    /// a candidate's physics). `key_path` is a scenario key such as
    /// `candidate[premium].turbine_inlet_temperature`; `candidate[<n>]` with
    /// a 0-based index and field names with unit suffixes
    /// (`turbine_inlet_temperature_k`, `net_output_kw`,
    /// `auxiliary_load_fraction`, `regenerator_effectiveness`) are accepted
    /// too. Unknown paths fall back to their nearest known parent.
    pub fn error_at(&self, key_path: &str, message: &str) -> crate::Error {
        let path = self.normalise(key_path);
        let offset = locate(&self.spans, &path).unwrap_or(0);
        let (line, column) = line_column(&self.source_text, offset);
        crate::Error::Input(format!(
            "{}:{line}:{column}: {path}: {message}",
            self.file_label
        ))
    }

    /// Map a code-side key path to the file's key path.
    fn normalise(&self, key_path: &str) -> String {
        let mut path = key_path.to_string();
        if let Some(rest) = path.strip_prefix("candidate[") {
            if let Some((index, tail)) = rest.split_once(']') {
                if let Some(c) = index
                    .parse::<usize>()
                    .ok()
                    .and_then(|i| self.scenario.candidates.get(i))
                {
                    path = format!("candidate[{}]{tail}", c.id);
                }
            }
        }
        if self.spans.contains_key(&path) {
            return path;
        }
        let (head, last) = match path.rsplit_once('.') {
            Some((h, l)) => (format!("{h}."), l.to_string()),
            None => (String::new(), path.clone()),
        };
        let mut name = last.as_str();
        for suffix in [
            "_fraction",
            "_kpa",
            "_kw",
            "_k",
            "_m",
            "_hours",
            "_per_year",
        ] {
            if let Some(stripped) = name.strip_suffix(suffix) {
                if self.spans.contains_key(&format!("{head}{stripped}")) {
                    return format!("{head}{stripped}");
                }
                name = stripped;
                break;
            }
        }
        for part in ["regenerator_", "intercooler_", "reheat_"] {
            if let Some(rest) = name.strip_prefix(part) {
                return format!("{head}{}.{rest}", part.trim_end_matches('_'));
            }
        }
        format!("{head}{name}")
    }
}

#[cfg(test)]
mod tests {
    use super::sha256_hex;

    #[test]
    fn a_file_that_is_not_utf8_is_bad_input_at_its_first_bad_byte() {
        let bytes = b"[scenario]\ntitle = \"caf\xE9\"\n".to_vec();
        let message = super::utf8_text(bytes, "latin1.toml")
            .err()
            .map(|e| e.to_string())
            .unwrap_or_default();
        assert!(
            message.starts_with("latin1.toml:2:13: file encoding: byte 23 (0xE9)"),
            "{message}"
        );
    }

    #[test]
    fn sha256_matches_the_fips_180_example() {
        // FIPS 180-2, Appendix B.1: SHA-256("abc").
        assert_eq!(
            sha256_hex(b"abc"),
            "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"
        );
    }
}
