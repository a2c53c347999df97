//! Command-line definitions only (clap). No computation lives here.

use clap::{Args, Parser, Subcommand, ValueEnum};
use std::path::PathBuf;

/// brayfin: gas-turbine bid evaluation from the thermodynamic cycle to the
/// break-even premium. Screening-level estimates; not a substitute for vendor
/// guarantees, acceptance testing, or licensed engineering and financial advice.
#[derive(Debug, Parser)]
#[command(name = "brayfin", version, about, long_about = None)]
pub struct Cli {
    /// The command to run.
    #[command(subcommand)]
    pub command: Command,
}

/// Output format for commands that print results.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum Format {
    /// Aligned tables for people.
    Table,
    /// One JSON object for scripts.
    Json,
    /// Comma-separated values (long format).
    Csv,
}

/// Unit system for presentation.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum UnitSystem {
    /// SI: K, kPa, kJ/kg, kJ/(kg·K), kg/s, kJ/kWh, currency per GJ.
    Si,
    /// US customary: °F, psia, Btu/lb, Btu/(lb·°R), lb/h, MMBtu/h, Btu/kWh,
    /// currency per MMBtu.
    Us,
}

/// Paper size of the PDF briefing.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum Paper {
    /// ISO A4, 210 mm × 297 mm.
    A4,
    /// US Letter, 8.5 in × 11 in.
    Letter,
}

/// Gas property model of the cycle solver.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum GasModelArg {
    /// Constant cp and k (cold-air standard).
    ColdAir,
    /// Variable-property dry air (NASA 7-coefficient polynomials).
    Air,
    /// Air, then complete-combustion products of the fuel through the turbine.
    Products,
}

/// The subcommands.
// Parsed once per process; the size difference between variants is
// irrelevant, so the variants are not boxed.
#[allow(clippy::large_enum_variant)]
#[derive(Debug, Subcommand)]
pub enum Command {
    /// Solve one gas-turbine cycle and print its state table and heat rate.
    Cycle(CycleArgs),
    /// Compare the candidates of a scenario against its baseline.
    Compare(CompareArgs),
    /// Each candidate as a fixed machine over ambient temperatures and loads.
    Offdesign(OffdesignArgs),
    /// Write the PDF briefing of a scenario.
    Report(ReportArgs),
    /// Vary one or two scenario inputs over a range and re-solve each point.
    Sweep(SweepArgs),
    /// Monte Carlo over the scenario's [uncertainty] section.
    Risk(RiskArgs),
    /// Validate a scenario file and print a normalised summary with warnings.
    Check(CheckArgs),
    /// Write a starter scenario file from a template.
    New(NewArgs),
    /// Write the audit workbook (.xlsx): the ledgers as live formulas.
    Workbook(WorkbookArgs),
}

/// Flags of `brayfin cycle`. Temperatures take `K`, `degC`, `degF`, `degR`
/// (bare number: K); pressures `kPa`, `Pa`, `bar`, `psia` (bare: kPa);
/// power `kW`, `MW` (bare: kW); fractions `0.86` or `86 %`.
#[derive(Debug, Args)]
#[command(allow_negative_numbers = true)]
pub struct CycleArgs {
    /// Compressor pressure ratio (> 1).
    #[arg(long)]
    pub pressure_ratio: String,
    /// Turbine inlet temperature (bare number: K).
    #[arg(long)]
    pub turbine_inlet_temperature: String,
    /// Ambient (compressor inlet) temperature (bare number: K).
    #[arg(long, default_value = "288.15 K")]
    pub ambient_temperature: String,
    /// Ambient pressure (bare number: kPa).
    #[arg(long, default_value = "101.325 kPa")]
    pub ambient_pressure: String,
    /// Compressor efficiency, isentropic unless --polytropic (0 < e <= 1).
    /// Default 1 (ideal; the output says so).
    #[arg(long)]
    pub compressor_efficiency: Option<String>,
    /// Turbine efficiency, isentropic unless --polytropic (0 < e <= 1).
    /// Default 1 (ideal; the output says so).
    #[arg(long)]
    pub turbine_efficiency: Option<String>,
    /// The compressor and turbine efficiencies are polytropic.
    #[arg(long)]
    pub polytropic: bool,
    /// Regenerator effectiveness (0 < e < 1); omit for no regenerator.
    #[arg(long)]
    pub regenerator_effectiveness: Option<String>,
    /// Regenerator pressure loss on each side, fraction of inlet pressure.
    #[arg(long, default_value = "0")]
    pub regenerator_pressure_loss: String,
    /// Combustor pressure loss, fraction of inlet pressure.
    #[arg(long, default_value = "0")]
    pub combustor_pressure_loss: String,
    /// Fraction of the fuel's heating value released (0 < e <= 1).
    #[arg(long, default_value = "1.0")]
    pub combustion_efficiency: String,
    /// Inlet duct and filter pressure loss, fraction of ambient pressure.
    #[arg(long, default_value = "0")]
    pub inlet_pressure_loss: String,
    /// Exhaust pressure loss, fraction of ambient pressure.
    #[arg(long, default_value = "0")]
    pub exhaust_pressure_loss: String,
    /// Mechanical efficiency of the shaft train (0 < e <= 1).
    /// Default 1 (ideal; the output says so).
    #[arg(long)]
    pub mechanical_efficiency: Option<String>,
    /// Generator efficiency (0 < e <= 1).
    /// Default 1 (ideal; the output says so).
    #[arg(long)]
    pub generator_efficiency: Option<String>,
    /// Auxiliary load, fraction of gross electrical output.
    #[arg(long, default_value = "0")]
    pub auxiliary_load: String,
    /// Fraction of compressor delivery air that bypasses the combustor and
    /// mixes in ahead of the turbine rotor.
    #[arg(long, default_value = "0")]
    pub turbine_cooling: String,
    /// Ambient relative humidity (`60 %` or 0.6); needs --gas air or products.
    #[arg(long, default_value = "0")]
    pub relative_humidity: String,
    /// Intercooler exit temperature; omit for no intercooler (split at the
    /// geometric mean pressure).
    #[arg(long)]
    pub intercool_temperature: Option<String>,
    /// Reheat combustor exit temperature; omit for no reheat (split at the
    /// geometric mean pressure).
    #[arg(long)]
    pub reheat_temperature: Option<String>,
    /// Gas property model.
    #[arg(long, value_enum, default_value = "air")]
    pub gas: GasModelArg,
    /// Fuel: `methane`, or a mole-fraction composition such as
    /// `CH4=0.95,C2H6=0.03,N2=0.02`.
    #[arg(long, default_value = "methane")]
    pub fuel: String,
    /// Rated net electrical output (bare number: kW); gives the flows.
    #[arg(long)]
    pub net_output: Option<String>,
    /// Output format (table, json or csv).
    #[arg(long, value_enum, default_value = "table")]
    pub format: Format,
    /// Unit system of the table and CSV (JSON is always SI, units in the key names).
    #[arg(long, value_enum, default_value = "si")]
    pub units: UnitSystem,
}

/// Flags of `brayfin compare`.
#[derive(Debug, Args)]
pub struct CompareArgs {
    /// Scenario file (TOML).
    pub scenario: PathBuf,
    /// Output format; csv prints the year-by-year ledger of every candidate.
    #[arg(long, value_enum, default_value = "table")]
    pub format: Format,
    /// Unit system of the tables.
    #[arg(long, value_enum, default_value = "si")]
    pub units: UnitSystem,
    /// Also rank the uncertain inputs by their swing in net savings.
    #[arg(long)]
    pub sensitivity: bool,
}

/// Flags of `brayfin offdesign`. Lists are comma-separated values, each
/// with its unit: `--temperature "0 degC,15 degC,35 degC"`,
/// `--load "100 %,75 %,50 %"`.
#[derive(Debug, Args)]
#[command(allow_negative_numbers = true)]
pub struct OffdesignArgs {
    /// Scenario file (TOML).
    pub scenario: PathBuf,
    /// Only this candidate (default: all).
    #[arg(long)]
    pub candidate: Option<String>,
    /// Ambient temperatures (bare number: K); default -10 degC to 45 degC
    /// in 5 K steps.
    #[arg(long, allow_hyphen_values = true)]
    pub temperature: Option<String>,
    /// Loads, fractions of the base-load output at each ambient (`75 %` or
    /// 0.75); default 100 % down to each candidate's minimum load in 10 %
    /// steps.
    #[arg(long)]
    pub load: Option<String>,
    /// Site elevation (bare number: m); the pressure then follows ISO 2533.
    /// Default: the scenario site's pressure.
    #[arg(long, conflicts_with = "pressure", allow_hyphen_values = true)]
    pub elevation: Option<String>,
    /// Ambient pressure (bare number: kPa); default: the scenario site's.
    #[arg(long)]
    pub pressure: Option<String>,
    /// Relative humidity (`60 %` or 0.6); default: the scenario site's.
    #[arg(long)]
    pub relative_humidity: Option<String>,
    /// Output format (table, json or csv).
    #[arg(long, value_enum, default_value = "table")]
    pub format: Format,
    /// Unit system of the table and CSV (JSON is always SI, units in the key names).
    #[arg(long, value_enum, default_value = "si")]
    pub units: UnitSystem,
}

/// Flags of `brayfin report`.
#[derive(Debug, Args)]
pub struct ReportArgs {
    /// Scenario file (TOML).
    pub scenario: PathBuf,
    /// Output PDF path, ending in `.pdf` (default: the scenario path with
    /// `.pdf`).
    #[arg(short = 'o', long = "output")]
    pub output: Option<PathBuf>,
    /// Unit system of the tables.
    #[arg(long, value_enum, default_value = "si")]
    pub units: UnitSystem,
    /// Folder of report templates replacing the built-in wording.
    #[arg(long)]
    pub templates: Option<PathBuf>,
    /// Paper size.
    #[arg(long, value_enum, default_value = "a4")]
    pub paper: Paper,
    /// Monte Carlo samples for the risk section (0 leaves it out); the same
    /// default as `brayfin risk`, so both print the same figures.
    #[arg(long, default_value_t = crate::analysis::risk::DEFAULT_SAMPLES)]
    pub samples: usize,
    /// Random seed of the risk section.
    #[arg(long, default_value_t = 1)]
    pub seed: u64,
}

/// Flags of `brayfin sweep`.
#[derive(Debug, Args)]
pub struct SweepArgs {
    /// Scenario file (TOML).
    pub scenario: PathBuf,
    /// `KEY=FROM:TO:STEP`, a dotted scenario key such as `fuel.price` or
    /// `candidate[premium].turbine_efficiency`. The three numbers may carry
    /// one unit, the same on each (`2 USD/MMBtu:12 USD/MMBtu:1 USD/MMBtu`,
    /// `86%:92%:1%`); bare numbers are in the key's internal unit (fractions
    /// as 0.88, K, h, currency per GJ on the scenario's price basis; see
    /// docs/sweep-and-risk.md). Give it once or twice (a grid).
    #[arg(long = "vary", required = true)]
    pub vary: Vec<String>,
    /// Only this candidate (default: all).
    #[arg(long)]
    pub candidate: Option<String>,
    /// Re-solve every machine in full wherever a point moves a bid's engine
    /// (component efficiencies, regenerator) instead of scaling the site
    /// figures solved once at the file's values by a re-solved rating
    /// point: slower, for checking the default route.
    #[arg(long)]
    pub exact: bool,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: Format,
    /// Unit system of the heat rate (the varied keys print in the unit
    /// their range was written in).
    #[arg(long, value_enum, default_value = "si")]
    pub units: UnitSystem,
}

/// Flags of `brayfin risk`.
#[derive(Debug, Args)]
pub struct RiskArgs {
    /// Scenario file (TOML).
    pub scenario: PathBuf,
    /// Number of Monte Carlo samples (the same default as `brayfin report`).
    #[arg(long, default_value_t = crate::analysis::risk::DEFAULT_SAMPLES)]
    pub samples: usize,
    /// Random seed; the same seed gives identical results on any thread count.
    #[arg(long, default_value_t = 1)]
    pub seed: u64,
    /// Re-solve every machine in full wherever a draw moves a bid's engine
    /// (component efficiencies, regenerator) instead of scaling the site
    /// figures solved once at the file's values by a re-solved rating
    /// point: slower, for checking the default route.
    #[arg(long)]
    pub exact: bool,
    /// Output format.
    #[arg(long, value_enum, default_value = "table")]
    pub format: Format,
    /// Unit system (risk prints money only; accepted so that every
    /// command takes the same option, and echoed in the output).
    #[arg(long, value_enum, default_value = "si")]
    pub units: UnitSystem,
}

/// Flags of `brayfin check`.
#[derive(Debug, Args)]
pub struct CheckArgs {
    /// Scenario file (TOML).
    pub scenario: PathBuf,
    /// Unit system of the summary.
    #[arg(long, value_enum, default_value = "si")]
    pub units: UnitSystem,
}

/// Flags of `brayfin new`.
#[derive(Debug, Args)]
pub struct NewArgs {
    /// Where to write the starter scenario; an existing file is never
    /// overwritten.
    pub path: PathBuf,
    /// Starter template name (see `templates/`).
    #[arg(long, default_value = "bid-evaluation")]
    pub template: String,
}

/// Flags of `brayfin workbook`.
#[derive(Debug, Args)]
pub struct WorkbookArgs {
    /// Scenario file (TOML).
    pub scenario: PathBuf,
    /// Output workbook path, ending in .xlsx (default: the scenario path
    /// with `.xlsx`).
    #[arg(short = 'o', long = "output")]
    pub output: Option<PathBuf>,
}
