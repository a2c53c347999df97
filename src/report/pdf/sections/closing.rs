//! Method, references, cautions, and the traceability block that ends the
//! report (brayfin version, scenario SHA-256, when it was generated).

use super::{prose, Ctx};
use crate::report::pdf::document::{line_height_mm, Composer, Orientation};
use crate::report::pdf::table::{draw_table, Column, TableStyle};
use crate::Result;

/// The cautions, at the end of the briefing and before the appendix, so a
/// reader who stops there has read them.
pub fn cautions(ctx: &Ctx, composer: &mut Composer) -> Result<()> {
    composer.heading(&ctx.labels.cautions, 1, 30.0);
    prose(composer, &ctx.wording.render("cautions.j2", &ctx.base)?);
    Ok(())
}

/// Lay out method and references, then the traceability block.
pub fn closing(ctx: &Ctx, composer: &mut Composer) -> Result<()> {
    let l = ctx.labels;
    composer.new_page(Orientation::Portrait);
    composer.heading(&l.method, 1, 30.0);
    prose(composer, &ctx.wording.render("method.j2", &ctx.base)?);

    composer.heading(&l.references, 1, 20.0);
    prose(composer, &ctx.wording.render("references.j2", &ctx.base)?);

    let meta = &ctx.model.meta;
    let rows = vec![
        vec![l.version.clone(), meta.brayfin_version.clone()],
        vec![l.scenario_file.clone(), meta.scenario_file.clone()],
        vec![l.scenario_sha256.clone(), meta.scenario_sha256.clone()],
        vec![l.generated_at.clone(), meta.generated_at.clone()],
    ];
    let needed = line_height_mm(11.5) + 6.0 * line_height_mm(8.0) + 8.0;
    if composer.remaining_mm() < needed {
        composer.new_page(Orientation::Portrait);
    }
    composer.heading(&l.traceability, 2, needed);
    draw_table(
        composer,
        &[Column::left(String::new()), Column::left(String::new())],
        &rows,
        &TableStyle {
            size_pt: 8.0,
            max_lines: 3,
            bold_first_column: true,
            header: false,
        },
    );
    Ok(())
}
