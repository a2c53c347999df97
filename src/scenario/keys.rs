//! Dotted key paths into a scenario: list, read and set numeric values
//! (`--vary`, `[uncertainty]`). Values are in each key's internal unit (see
//! `docs/scenario.md`, "Key paths").

use super::candidate_fields::CANDIDATE_FIELDS;
use super::error::KeyError;
use super::fields::{CandidateField, ScenarioField, SCENARIO_FIELDS};
use super::suggest::closest;
use super::types::Scenario;
use super::validate::cross_check;
use crate::units::Kind;

/// A parsed key path.
pub(crate) enum Target<'k> {
    /// A field of the shared sections.
    Shared(&'static ScenarioField),
    /// A candidate field, for every candidate (`None`) or the one with this id.
    Candidate(Option<&'k str>, &'static CandidateField),
}

/// Parse `key` into what it points at, with a did-you-mean when unknown.
pub(crate) fn resolve<'k>(scenario: &Scenario, key: &'k str) -> Result<Target<'k>, KeyError> {
    let (id, rest) = if let Some(rest) = key.strip_prefix("candidate.") {
        (None, Some(rest))
    } else if let Some(inner) = key.strip_prefix("candidate[") {
        match inner.split_once("].") {
            Some((id, rest)) => (Some(id), Some(rest)),
            None => (None, None),
        }
    } else {
        (None, None)
    };
    let Some(rest) = rest else {
        return SCENARIO_FIELDS
            .iter()
            .find(|f| f.key == key)
            .map(Target::Shared)
            .ok_or_else(|| unknown(key));
    };
    if let Some(id) = id {
        if !scenario.candidates.iter().any(|c| c.id == id) {
            return Err(KeyError::UnknownCandidate {
                key: key.to_string(),
                id: id.to_string(),
                valid: candidate_ids(scenario),
            });
        }
    }
    match CANDIDATE_FIELDS.iter().find(|f| f.key == rest) {
        Some(field) => Ok(Target::Candidate(id, field)),
        None => Err(KeyError::Unknown {
            key: key.to_string(),
            suggestion: closest(rest, CANDIDATE_FIELDS.iter().map(|f| f.key)).map(
                |name| match id {
                    Some(id) => format!("candidate[{id}].{name}"),
                    None => format!("candidate.{name}"),
                },
            ),
        }),
    }
}

fn unknown(key: &str) -> KeyError {
    let generic: Vec<String> = CANDIDATE_FIELDS
        .iter()
        .map(|f| format!("candidate.{}", f.key))
        .collect();
    let all = SCENARIO_FIELDS
        .iter()
        .map(|f| f.key)
        .chain(generic.iter().map(String::as_str));
    KeyError::Unknown {
        key: key.to_string(),
        suggestion: closest(key, all).map(str::to_string),
    }
}

fn candidate_ids(scenario: &Scenario) -> String {
    scenario
        .candidates
        .iter()
        .map(|c| c.id.as_str())
        .collect::<Vec<_>>()
        .join(", ")
}

/// The unit kind of the value `key` points at (how a value for it is
/// written with a unit).
pub(crate) fn kind_of_key(scenario: &Scenario, key: &str) -> Result<Kind, KeyError> {
    Ok(match resolve(scenario, key)? {
        Target::Shared(field) => field.kind,
        Target::Candidate(_, field) => field.kind,
    })
}

impl Scenario {
    /// Every numeric key of this scenario by dotted path: shared keys such
    /// as `fuel.price`, then `candidate.<field>` (all candidates having the
    /// field) and `candidate[<id>].<field>` for each candidate. Keys that do
    /// not apply (e.g. regenerator fields when no candidate has one) are
    /// left out.
    pub fn numeric_keys(&self) -> Vec<String> {
        let mut keys: Vec<String> = SCENARIO_FIELDS
            .iter()
            .filter(|f| (f.get)(self).is_some())
            .map(|f| f.key.to_string())
            .collect();
        for field in CANDIDATE_FIELDS {
            if self.candidates.iter().any(|c| (field.get)(c).is_some()) {
                keys.push(format!("candidate.{}", field.key));
            }
        }
        for candidate in &self.candidates {
            for field in CANDIDATE_FIELDS {
                if (field.get)(candidate).is_some() {
                    keys.push(format!("candidate[{}].{}", candidate.id, field.key));
                }
            }
        }
        keys
    }

    /// The value at `key` in its internal unit. `candidate.<field>` is
    /// accepted when every candidate having the field has the same value.
    pub fn get_numeric(&self, key: &str) -> Result<f64, KeyError> {
        match resolve(self, key)? {
            Target::Shared(field) => (field.get)(self).ok_or_else(|| not_applicable(key)),
            Target::Candidate(id, field) => {
                let mut values = self
                    .candidates
                    .iter()
                    .filter(|c| id.is_none_or(|id| c.id == id))
                    .filter_map(|c| (field.get)(c).map(|v| (c, v)));
                let Some((first, value)) = values.next() else {
                    return Err(not_applicable(key));
                };
                if values.any(|(_, v)| v != value) {
                    return Err(KeyError::Ambiguous {
                        key: key.to_string(),
                        example: format!("candidate[{}].{}", first.id, field.key),
                    });
                }
                Ok(value)
            }
        }
    }

    /// Set the value at `key` (internal unit). `candidate.<field>` sets it
    /// on every candidate that has the field. The value's range is checked,
    /// then the cross-field rules (e.g. turbine inlet above ambient); on any
    /// error the scenario is left unchanged.
    pub fn set_numeric(&mut self, key: &str, value_si: f64) -> Result<(), KeyError> {
        let target = resolve(self, key)?;
        let range = match &target {
            Target::Shared(field) => field.range,
            Target::Candidate(_, field) => field.range,
        };
        range
            .check(value_si)
            .map_err(|(problem, valid)| KeyError::OutOfRange {
                key: key.to_string(),
                problem,
                valid,
            })?;
        let result = match target {
            Target::Shared(field) => {
                let old = (field.get)(self);
                let outcome = (field.set)(self, value_si);
                self.finish_set(key, outcome, |s| {
                    if let Some(old) = old {
                        let _ = (field.set)(s, old);
                    }
                })
            }
            Target::Candidate(id, field) => {
                let selected = |c: &super::candidate::Candidate| {
                    id.map_or((field.get)(c).is_some(), |id| c.id == id)
                };
                let olds: Vec<Option<f64>> = self
                    .candidates
                    .iter()
                    .filter(|c| selected(c))
                    .map(|c| (field.get)(c))
                    .collect();
                if olds.is_empty() {
                    return Err(not_applicable(key));
                }
                // Every selected candidate gets the same value, so a setter
                // that refuses it refuses it for the first one, before any
                // change.
                let mut outcome = Ok(());
                for candidate in self.candidates.iter_mut().filter(|c| selected(c)) {
                    outcome = (field.set)(candidate, value_si);
                    if outcome.is_err() {
                        break;
                    }
                }
                self.finish_set(key, outcome, |s| {
                    let targets = s.candidates.iter_mut().filter(|c| selected(c));
                    for (candidate, old) in targets.zip(&olds) {
                        if let Some(old) = old {
                            let _ = (field.set)(candidate, *old);
                        }
                    }
                })
            }
        };
        result
    }

    /// After a set: run the cross-field rules; on any failure undo the set
    /// with `restore` and say why.
    fn finish_set(
        &mut self,
        key: &str,
        outcome: Result<(), String>,
        restore: impl FnOnce(&mut Scenario),
    ) -> Result<(), KeyError> {
        // A setter that refuses a value changes nothing (each checks before
        // it writes), so only a set that breaks a cross-field rule is undone.
        match outcome {
            Ok(()) => cross_check(self).map_err(|v| {
                restore(self);
                KeyError::OutOfRange {
                    key: key.to_string(),
                    problem: format!("{}: {}", v.field, v.problem),
                    valid: v.valid,
                }
            }),
            Err(why) => Err(KeyError::NotApplicable {
                key: key.to_string(),
                why,
            }),
        }
    }
}

fn not_applicable(key: &str) -> KeyError {
    KeyError::NotApplicable {
        key: key.to_string(),
        why: "no value of this kind is present in the scenario (e.g. no candidate has that part)"
            .into(),
    }
}
