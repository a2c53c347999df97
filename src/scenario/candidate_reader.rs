//! Reading the `[[candidate]]` array (keys declared in `candidate.rs`): one
//! bid each, with optional regenerator, intercooler, reheat and rating
//! tables and a costs table.

use super::candidate::{
    Candidate, EfficiencyBasis, GasModelSpec, HeatRateBasisSpec, IntercoolerSpec, RatingCondition,
    RatingFigures, RegeneratorSpec, ReheatSpec, KEYS,
};
use super::candidate_control::{read_control, ControlSpec};
use super::candidate_costs::read_costs;
use super::candidate_curves::{read_ambient_correction, read_part_load};
use super::candidate_fit::{fit_unstated, COMPONENT_KEYS};
use super::candidate_guarantee::read_guarantee;
use super::context::Context;
use super::declare::{find, keys_in, Key};
use super::error::ScenarioError;
use super::reader::{type_error, TableReader};
use super::tree::{Node, NodeValue};
use super::types::FuelSpec;
use super::values::money;
use crate::units;
use chrono::NaiveDate;

type Read<T> = Result<T, ScenarioError>;

/// Longest candidate id: ids head table columns and file names.
const MAX_ID_CHARS: usize = 64;

/// The declaration of `path` (a candidate key), or an error naming it.
fn key(ctx: &Context, path: &str) -> Read<&'static Key<Candidate>> {
    find(KEYS, path).ok_or_else(|| {
        ctx.error_at_offset(
            0,
            path,
            "is not declared (a fault in brayfin)",
            "expected a declared candidate key",
        )
    })
}

/// Read every `[[candidate]]`; at least one, ids unique.
pub(crate) fn read_candidates(
    ctx: &mut Context,
    node: Option<&Node>,
    commercial_operation: NaiveDate,
    fuel: &FuelSpec,
) -> Read<Vec<Candidate>> {
    let valid = "expected at least one [[candidate]] table with an id, capital_cost, net_output, …";
    let Some(node) = node else {
        return Err(ctx.error_at_offset(0, "candidate", "no candidates are given", valid));
    };
    let NodeValue::Array(items) = &node.value else {
        return Err(type_error(
            ctx,
            "candidate",
            node,
            "an array of tables written [[candidate]]",
        ));
    };
    if items.is_empty() {
        return Err(ctx.error_at_offset(
            node.span.start,
            "candidate",
            "the candidate list is empty",
            valid,
        ));
    }
    let mut candidates: Vec<Candidate> = Vec::with_capacity(items.len());
    for (i, item) in items.iter().enumerate() {
        let candidate = read_candidate(ctx, item, i, commercial_operation, fuel)?;
        if candidates.iter().any(|c| c.id == candidate.id) {
            return Err(ctx.error_for(
                &format!("candidate[#{}].id", i + 1),
                format!(
                    "{:?} is already the id of an earlier candidate",
                    candidate.id
                ),
                "expected a unique id for each candidate",
            ));
        }
        candidates.push(candidate);
    }
    Ok(candidates)
}

/// A candidate id: a letter, then letters, digits, `-` or `_`.
fn is_valid_id(id: &str) -> bool {
    let mut chars = id.chars();
    chars.next().is_some_and(|c| c.is_ascii_alphabetic())
        && chars.all(|c| c.is_ascii_alphanumeric() || c == '-' || c == '_')
}

fn read_candidate(
    ctx: &mut Context,
    node: &Node,
    index: usize,
    cod: NaiveDate,
    fuel: &FuelSpec,
) -> Read<Candidate> {
    let provisional = format!("candidate[#{}]", index + 1);
    let NodeValue::Table(entries) = &node.value else {
        return Err(type_error(
            ctx,
            &provisional,
            node,
            "a table written [[candidate]]",
        ));
    };
    let id_field = format!("{provisional}.id");
    let id_entry = entries.iter().find(|e| e.key == "id");
    if let Some(entry) = id_entry {
        ctx.spans.insert(id_field.clone(), entry.node.span.clone());
    }
    let id = match id_entry.map(|e| &e.node) {
        Some(Node {
            value: NodeValue::Str(id),
            ..
        }) => id.clone(),
        Some(other) => return Err(type_error(ctx, &id_field, other, "a string")),
        None => {
            return Err(ctx.error_at_offset(
                node.span.start,
                &id_field,
                format!("is missing from [{provisional}]"),
                "expected an id such as id = \"premium\"",
            ))
        }
    };
    if id.chars().count() > MAX_ID_CHARS {
        let offset = id_entry.map_or(node.span.start, |e| e.node.span.start);
        return Err(ctx.error_at_offset(
            offset,
            &id_field,
            format!("is {} characters long", id.chars().count()),
            format!("expected an id of at most {MAX_ID_CHARS} characters"),
        ));
    }
    if !is_valid_id(&id) {
        let offset = id_entry.map_or(node.span.start, |e| e.node.span.start);
        return Err(ctx.error_at_offset(
            offset,
            &id_field,
            format!("{id:?} is not a valid id"),
            "expected a letter followed by letters, digits, - or _ (e.g. \"premium-b\")",
        ));
    }
    let path = format!("candidate[{id}]");
    let mut allowed = keys_in(KEYS, "");
    allowed.extend(keys_in(super::candidate_guarantee::KEYS, ""));
    let r = TableReader::new(ctx, &path, node, &allowed)?;
    r.string(ctx, "id")?;
    let label = match r.string(ctx, "label")? {
        Some(label) => label,
        None => {
            r.default(ctx, "label", &id);
            id.clone()
        }
    };
    let capital_cost = money(ctx, &r, "capital_cost", units::money)?.ok_or_else(|| {
        r.missing(
            ctx,
            "capital_cost",
            "expected the installed capital cost, e.g. \"48500000 USD\"",
        )
    })?;
    let net_output_kw = r.required_quantity(
        ctx,
        "net_output",
        units::power_kw,
        "expected the rated net output, e.g. \"45 MW\"",
    )?;
    let gas_model = read_gas_model(ctx, &r)?;
    // The four component keys: all given (the stated machine), or none
    // with a datasheet in [candidate.rating] (the machine fitted to it,
    // `candidate_fit.rs`); checked once the rating is read.
    let pressure_ratio = r.quantity(ctx, "pressure_ratio", units::number)?;
    let turbine_inlet_temperature_k =
        r.quantity(ctx, "turbine_inlet_temperature", units::temperature_k)?;
    let compressor_efficiency = r.quantity(ctx, "compressor_efficiency", units::fraction)?;
    let turbine_efficiency = r.quantity(ctx, "turbine_efficiency", units::fraction)?;
    let stated = [
        pressure_ratio,
        turbine_inlet_temperature_k,
        compressor_efficiency,
        turbine_efficiency,
    ];
    let efficiency_basis = match r.choice(
        ctx,
        "efficiency_basis",
        &["isentropic", "polytropic"],
        "isentropic",
    )? {
        "polytropic" => EfficiencyBasis::Polytropic,
        _ => EfficiencyBasis::Isentropic,
    };
    let mut number = |path: &str| -> Read<f64> {
        let key = key(ctx, path)?;
        Ok(r.declared(ctx, key)?.unwrap_or(f64::NAN))
    };
    let inlet_pressure_loss = number("inlet_pressure_loss")?;
    let exhaust_pressure_loss = number("exhaust_pressure_loss")?;
    let combustor_pressure_loss = number("combustor_pressure_loss")?;
    let combustion_efficiency = number("combustion_efficiency")?;
    let mechanical_efficiency = number("mechanical_efficiency")?;
    let generator_efficiency = number("generator_efficiency")?;
    let auxiliary_load_fraction = number("auxiliary_load")?;
    let turbine_cooling = number("turbine_cooling")?;
    let regenerator = read_regenerator(ctx, &r)?;
    let intercooler = read_intercooler(ctx, &r)?;
    let reheat = read_reheat(ctx, &r)?;
    let costs = read_costs(ctx, &r, cod)?;
    let guarantee = read_guarantee(ctx, &r)?;
    let mut candidate = Candidate {
        id,
        label,
        capital_cost,
        net_output_kw,
        gas_model,
        pressure_ratio: pressure_ratio.unwrap_or(f64::NAN),
        turbine_inlet_temperature_k: turbine_inlet_temperature_k.unwrap_or(f64::NAN),
        compressor_efficiency: compressor_efficiency.unwrap_or(f64::NAN),
        turbine_efficiency: turbine_efficiency.unwrap_or(f64::NAN),
        efficiency_basis,
        inlet_pressure_loss,
        exhaust_pressure_loss,
        combustor_pressure_loss,
        combustion_efficiency,
        mechanical_efficiency,
        generator_efficiency,
        auxiliary_load_fraction,
        regenerator,
        intercooler,
        reheat,
        turbine_cooling,
        // Every rating key has a declared default, so each NaN is
        // overwritten by `read_rating` (and a NaN left would fail the
        // range check).
        rating: RatingCondition {
            temperature_k: f64::NAN,
            pressure_kpa: f64::NAN,
            relative_humidity: f64::NAN,
            datasheet: None,
        },
        control: ControlSpec::default(),
        part_load: Vec::new(),
        ambient_correction: Vec::new(),
        fitted: None,
        costs,
        guarantee,
    };
    read_rating(ctx, &r, &mut candidate)?;
    read_control(ctx, &r, &mut candidate)?;
    candidate.part_load = read_part_load(ctx, &r)?;
    candidate.ambient_correction =
        read_ambient_correction(ctx, &r, candidate.rating.temperature_k)?;
    if stated.iter().all(Option::is_none) && candidate.rating.datasheet.is_some() {
        fit_unstated(ctx, &r, &mut candidate, fuel)?;
    } else if let Some(i) = stated.iter().position(Option::is_none) {
        let examples = [
            "the compressor pressure ratio, e.g. 18",
            "a temperature, e.g. \"1450 K\"",
            "an efficiency such as \"88 %\" or 0.88",
            "an efficiency such as \"88 %\" or 0.88",
        ];
        return Err(r.missing(
            ctx,
            COMPONENT_KEYS[i],
            &format!(
                "expected {}; the four component keys go together, or all four are left \
                 out and the vendor's heat_rate, exhaust_flow and exhaust_temperature in \
                 [candidate.rating] fit them",
                examples[i]
            ),
        ));
    }
    Ok(candidate)
}

/// `[candidate.rating]`: every declared `rating.*` key, read generically.
fn read_rating(ctx: &mut Context, r: &TableReader, candidate: &mut Candidate) -> Read<()> {
    let empty = Node {
        span: r.span.clone(),
        value: NodeValue::Table(Vec::new()),
    };
    let node = r.node(ctx, "rating").unwrap_or(&empty);
    let t = TableReader::new(ctx, &r.field("rating"), node, &keys_in(KEYS, "rating"))?;
    // The vendor's figures come as a group: heat rate, exhaust flow and
    // exhaust temperature together (the energy balance needs all three).
    const GROUP: [&str; 3] = ["heat_rate", "exhaust_flow", "exhaust_temperature"];
    let stated = GROUP.iter().any(|k| t.has(k));
    if stated {
        candidate.rating.datasheet = Some(RatingFigures::unread());
    } else if let Some(key) = ["heat_rate_basis", "pressure_ratio", "firing_temperature"]
        .into_iter()
        .find(|k| t.has(k))
    {
        return Err(t.error(
            ctx,
            key,
            "is a figure of the vendor's datasheet, but the rating states no heat rate, \
             exhaust flow and exhaust temperature",
            "expected `heat_rate`, `exhaust_flow` and `exhaust_temperature` beside it, or no datasheet keys",
        ));
    }
    t.declared_into(ctx, KEYS, "rating", candidate)?;
    if stated {
        if let Some(missing) = GROUP.into_iter().find(|k| !t.has(k)) {
            let given: Vec<&str> = GROUP.into_iter().filter(|k| t.has(k)).collect();
            return Err(r.error(
                ctx,
                "rating",
                format!(
                    "states {} but not `{missing}`",
                    given
                        .iter()
                        .map(|k| format!("`{k}`"))
                        .collect::<Vec<_>>()
                        .join(" and ")
                ),
                "expected `heat_rate`, `exhaust_flow` and `exhaust_temperature` together \
                 (the datasheet's energy balance needs all three), or none of them",
            ));
        }
        let basis = match t.choice(ctx, "heat_rate_basis", &["lhv", "hhv"], "lhv")? {
            "hhv" => HeatRateBasisSpec::Hhv,
            _ => HeatRateBasisSpec::Lhv,
        };
        if let Some(d) = candidate.rating.datasheet.as_mut() {
            d.heat_rate_basis = basis;
        }
    }
    Ok(())
}

fn read_gas_model(ctx: &mut Context, r: &TableReader) -> Read<GasModelSpec> {
    let model = r.choice(ctx, "gas_model", &["air", "products", "cold-air"], "air")?;
    if model != "cold-air" {
        if let Some(key) = ["cp_kj_per_kg_k", "specific_heat_ratio"]
            .iter()
            .find(|k| r.has(k))
        {
            return Err(r.error(
                ctx,
                key,
                format!("applies only to gas_model = \"cold-air\", not {model:?}"),
                "expected no constant specific heats with a variable-property gas model",
            ));
        }
    }
    Ok(match model {
        "products" => GasModelSpec::Products,
        // cp = 1.005 kJ/(kg·K), k = 1.4: the cold-air standard of the
        // engineering thermodynamics texts (common practice).
        "cold-air" => GasModelSpec::ColdAir {
            cp_kj_per_kg_k: r
                .declared(ctx, key(ctx, "cp_kj_per_kg_k")?)?
                .unwrap_or(f64::NAN),
            k: r.declared(ctx, key(ctx, "specific_heat_ratio")?)?
                .unwrap_or(f64::NAN),
        },
        _ => GasModelSpec::Air,
    })
}

fn sub_table<'a>(
    ctx: &mut Context,
    r: &TableReader,
    key: &str,
    node: &'a Node,
) -> Read<TableReader<'a>> {
    TableReader::new(ctx, &r.field(key), node, &keys_in(KEYS, key))
}

fn read_regenerator(ctx: &mut Context, r: &TableReader) -> Read<Option<RegeneratorSpec>> {
    let Some(node) = r.node(ctx, "regenerator") else {
        return Ok(None);
    };
    let t = sub_table(ctx, r, "regenerator", node)?;
    Ok(Some(RegeneratorSpec {
        effectiveness: t.required_quantity(
            ctx,
            "effectiveness",
            units::fraction,
            "expected an effectiveness such as \"85 %\"",
        )?,
        air_side_pressure_loss: t
            .declared(ctx, key(ctx, "regenerator.air_side_pressure_loss")?)?
            .unwrap_or(f64::NAN),
        gas_side_pressure_loss: t
            .declared(ctx, key(ctx, "regenerator.gas_side_pressure_loss")?)?
            .unwrap_or(f64::NAN),
    }))
}

fn read_intercooler(ctx: &mut Context, r: &TableReader) -> Read<Option<IntercoolerSpec>> {
    let Some(node) = r.node(ctx, "intercooler") else {
        return Ok(None);
    };
    let t = sub_table(ctx, r, "intercooler", node)?;
    let pressure_split = t.quantity(ctx, "pressure_split", units::number)?;
    if pressure_split.is_none() {
        t.default(ctx, "pressure_split", "geometric mean (√pressure_ratio)");
    }
    let exit_temperature_k = t.quantity(ctx, "exit_temperature", units::temperature_k)?;
    let effectiveness = t.quantity(ctx, "effectiveness", units::fraction)?;
    let valid = "expected exactly one of exit_temperature and effectiveness";
    match (exit_temperature_k, effectiveness) {
        (Some(_), Some(_)) => Err(t.error(
            ctx,
            "effectiveness",
            "is given together with exit_temperature",
            valid,
        )),
        (None, None) => Err(t.missing(ctx, "exit_temperature", valid)),
        _ => Ok(Some(IntercoolerSpec {
            pressure_split,
            exit_temperature_k,
            effectiveness,
        })),
    }
}

fn read_reheat(ctx: &mut Context, r: &TableReader) -> Read<Option<ReheatSpec>> {
    let Some(node) = r.node(ctx, "reheat") else {
        return Ok(None);
    };
    let t = sub_table(ctx, r, "reheat", node)?;
    let pressure_split = t.quantity(ctx, "pressure_split", units::number)?;
    if pressure_split.is_none() {
        t.default(ctx, "pressure_split", "geometric mean of the expansion");
    }
    let temperature_k = t.required_quantity(
        ctx,
        "temperature",
        units::temperature_k,
        "expected the reheat exit temperature, e.g. \"1400 K\"",
    )?;
    Ok(Some(ReheatSpec {
        pressure_split,
        temperature_k,
    }))
}
