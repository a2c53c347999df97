//! Dotted key paths into a scenario: list, read and set numeric values
//! (`--vary`, `[uncertainty]`). Values are in each key's internal unit (see
//! `docs/scenario.md`, "Key paths").

use super::candidate::Candidate;
use super::declare::{candidate_keys, scenario_keys, Access, Key};
use super::error::KeyError;
use super::suggest::closest;
use super::types::Scenario;
use super::validate::cross_check;
use crate::units::Kind;

/// A parsed key path.
pub(crate) enum Target<'k> {
    /// A field of the shared sections.
    Shared(&'static Key<Scenario>, Access<Scenario>),
    /// A candidate field, for every candidate (`None`) or the one with this id.
    Candidate(Option<&'k str>, &'static Key<Candidate>, Access<Candidate>),
}

/// The declared keys that are key paths (numeric, with a place in the
/// typed scenario).
fn shared_fields() -> impl Iterator<Item = (&'static Key<Scenario>, Access<Scenario>)> {
    scenario_keys().filter_map(|k| Some((k, k.access?)))
}

fn candidate_fields() -> impl Iterator<Item = (&'static Key<Candidate>, Access<Candidate>)> {
    candidate_keys().filter_map(|k| Some((k, k.access?)))
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
        return shared_fields()
            .find(|(f, _)| f.path == key)
            .map(|(f, a)| Target::Shared(f, a))
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
    match candidate_fields().find(|(f, _)| f.path == rest) {
        Some((field, access)) => Ok(Target::Candidate(id, field, access)),
        None => Err(KeyError::Unknown {
            key: key.to_string(),
            suggestion: closest(rest, candidate_fields().map(|(f, _)| f.path)).map(
                |name| match id {
                    Some(id) => format!("candidate[{id}].{name}"),
                    None => format!("candidate.{name}"),
                },
            ),
        }),
    }
}

fn unknown(key: &str) -> KeyError {
    let generic: Vec<String> = candidate_fields()
        .map(|(f, _)| format!("candidate.{}", f.path))
        .collect();
    let all = shared_fields()
        .map(|(f, _)| f.path)
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
    let kind = match resolve(scenario, key)? {
        Target::Shared(field, _) => field.kind(),
        Target::Candidate(_, field, _) => field.kind(),
    };
    kind.ok_or_else(|| unknown(key))
}

impl Scenario {
    /// Every numeric key of this scenario by dotted path: shared keys such
    /// as `fuel.price`, then `candidate.<field>` (all candidates having the
    /// field) and `candidate[<id>].<field>` for each candidate. Keys that do
    /// not apply (e.g. regenerator fields when no candidate has one) are
    /// left out.
    pub fn numeric_keys(&self) -> Vec<String> {
        let mut keys: Vec<String> = shared_fields()
            .filter(|(_, a)| (a.get)(self).is_some())
            .map(|(f, _)| f.path.to_string())
            .collect();
        for (field, access) in candidate_fields() {
            if self.candidates.iter().any(|c| (access.get)(c).is_some()) {
                keys.push(format!("candidate.{}", field.path));
            }
        }
        for candidate in &self.candidates {
            for (field, access) in candidate_fields() {
                if (access.get)(candidate).is_some() {
                    keys.push(format!("candidate[{}].{}", candidate.id, field.path));
                }
            }
        }
        keys
    }

    /// The unit kind declared for the numeric `key` (the kind of quantity
    /// its values hold, whose internal unit they are stored in).
    pub fn numeric_kind(&self, key: &str) -> Result<Kind, KeyError> {
        kind_of_key(self, key)
    }

    /// The value at `key` in its internal unit. `candidate.<field>` is
    /// accepted when every candidate having the field has the same value.
    pub fn get_numeric(&self, key: &str) -> Result<f64, KeyError> {
        match resolve(self, key)? {
            Target::Shared(_, access) => (access.get)(self).ok_or_else(|| not_applicable(key)),
            Target::Candidate(id, field, access) => {
                let mut values = self
                    .candidates
                    .iter()
                    .filter(|c| id.is_none_or(|id| c.id == id))
                    .filter_map(|c| (access.get)(c).map(|v| (c, v)));
                let Some((first, value)) = values.next() else {
                    return Err(not_applicable(key));
                };
                if values.any(|(_, v)| v != value) {
                    return Err(KeyError::Ambiguous {
                        key: key.to_string(),
                        example: format!("candidate[{}].{}", first.id, field.path),
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
        let checked = match &target {
            Target::Shared(field, _) => field.check(value_si),
            Target::Candidate(_, field, _) => field.check(value_si),
        };
        checked.map_err(|(problem, valid)| KeyError::OutOfRange {
            key: key.to_string(),
            problem,
            valid,
        })?;
        let result = match target {
            Target::Shared(_, field) => {
                let old = (field.get)(self);
                let outcome = (field.set)(self, value_si);
                self.finish_set(key, outcome, |s| {
                    if let Some(old) = old {
                        let _ = (field.set)(s, old);
                    }
                })
            }
            Target::Candidate(id, _, field) => {
                let selected = |c: &Candidate| id.map_or((field.get)(c).is_some(), |id| c.id == id);
                let olds: Vec<Option<f64>> = self
                    .candidates
                    .iter()
                    .filter(|c| selected(c))
                    .map(|c| (field.get)(c))
                    .collect();
                if olds.is_empty() {
                    return Err(not_applicable(key));
                }
                // Every selected candidate gets the same value; a setter
                // may still refuse it for a later one (a fitted bid), and
                // `finish_set` then restores the earlier ones.
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
        // it writes), but a generic `candidate.<field>` key may have set the
        // candidates before the one that refused (a fitted bid refuses the
        // keys its fit sets), so a refusal is undone as a set that breaks a
        // cross-field rule is.
        match outcome {
            Ok(()) => cross_check(self).map_err(|v| {
                restore(self);
                KeyError::OutOfRange {
                    key: key.to_string(),
                    problem: format!("{}: {}", v.field, v.problem),
                    valid: v.valid,
                }
            }),
            Err(why) => {
                restore(self);
                Err(KeyError::NotApplicable {
                    key: key.to_string(),
                    why,
                })
            }
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
