//! Reports a group can paste: every example session in every format against its golden file
//! (insta, `tests/snapshots/report_formats__*.snap`), Markdown that is well formed (headings
//! never jump a level, every table has its header and separator row), LaTeX that is typeset
//! (booktabs tables, no verbatim, the notation in math mode, the user's text escaped) and
//! compiles with pdflatex when it is installed, text without Markdown pipes, no negative
//! multiplicities, and exports that refuse what they cannot write.

use salcdesk::analysis;
use salcdesk::report::{self, export_format, latex, session as session_report, Format};
use salcdesk::session::{self, parse};
use std::path::{Path, PathBuf};
use std::process::Command;

fn examples() -> Vec<PathBuf> {
    let mut v: Vec<PathBuf> =
        std::fs::read_dir(Path::new(env!("CARGO_MANIFEST_DIR")).join("sessions"))
            .expect("sessions folder")
            .flatten()
            .map(|e| e.path())
            .filter(|p| p.extension().and_then(|e| e.to_str()) == Some("toml"))
            .collect();
    v.sort();
    assert!(v.len() >= 5);
    v
}

fn stem(p: &Path) -> String {
    p.file_stem().unwrap().to_string_lossy().replace('-', "_")
}

fn render(p: &Path, f: Format, ascii: bool) -> String {
    let s = session::load_file(p).unwrap();
    let a = analysis::analyze(&s);
    session_report::render(&s, &a, f, ascii)
}

const FORMATS: [(Format, &str); 4] = [
    (Format::Markdown, "md"),
    (Format::Latex, "tex"),
    (Format::Json, "json"),
    (Format::Text, "txt"),
];

#[test]
fn golden_files_for_every_example_in_every_format() {
    for p in examples() {
        for (f, ext) in FORMATS {
            let name = format!("{}_{ext}", stem(&p));
            insta::assert_snapshot!(name, render(&p, f, false));
        }
        insta::assert_snapshot!(
            format!("{}_txt_ascii", stem(&p)),
            render(&p, Format::Text, true)
        );
        let s = session::load_file(&p).unwrap();
        let a = analysis::analyze(&s);
        insta::assert_snapshot!(
            format!("{}_tex_fragment", stem(&p)),
            session_report::latex_fragment(&s, &a)
        );
    }
}

/// Markdown structure: heading levels never jump, tables are whole.
fn check_markdown(md: &str, what: &str) {
    let mut level = 0usize;
    let lines: Vec<&str> = md.lines().collect();
    let mut in_fence = false;
    let mut i = 0;
    while i < lines.len() {
        let l = lines[i];
        if l.starts_with("```") {
            in_fence = !in_fence;
        }
        if in_fence {
            i += 1;
            continue;
        }
        if l.starts_with('#') {
            let d = l.chars().take_while(|c| *c == '#').count();
            assert!(
                l[d..].starts_with(' '),
                "{what}: heading without space: {l}"
            );
            assert!(
                d <= level + 1,
                "{what}: heading jumps from {level} to {d}: {l}"
            );
            level = d;
        }
        if l.starts_with('|') {
            assert!(
                i == 0 || !lines[i - 1].starts_with('|'),
                "{what}: table starts mid-table"
            );
            let cols = |r: &str| r.replace("\\|", "").matches('|').count();
            let n = cols(l);
            let sep = lines.get(i + 1).copied().unwrap_or("");
            assert!(
                sep.starts_with("|---") && cols(sep) == n,
                "{what}: table without separator row after {l:?}"
            );
            assert!(
                i == 0 || lines[i - 1].trim().is_empty(),
                "{what}: a table needs a blank line before it: {l:?}"
            );
            let mut j = i;
            while j < lines.len() && lines[j].starts_with('|') {
                assert_eq!(cols(lines[j]), n, "{what}: ragged row {:?}", lines[j]);
                j += 1;
            }
            i = j;
            continue;
        }
        i += 1;
    }
    assert!(!in_fence, "{what}: unclosed fence");
    assert!(
        md.starts_with("# "),
        "{what}: starts with a level-1 heading"
    );
}

#[test]
fn markdown_headings_never_jump_and_every_table_is_a_table() {
    for p in examples() {
        for ascii in [false, true] {
            check_markdown(
                &render(&p, Format::Markdown, ascii),
                &p.display().to_string(),
            );
        }
    }
}

#[test]
fn latex_is_typeset_not_verbatim() {
    for p in examples() {
        let tex = render(&p, Format::Latex, false);
        let what = p.display();
        assert!(tex.contains("\\usepackage{booktabs}"), "{what}");
        assert!(!tex.contains("verbatim"), "{what}: verbatim block");
        assert!(!tex.contains("\n|"), "{what}: a Markdown pipe table");
        assert!(!tex.contains("Gammavib") && !tex.contains("nu1"), "{what}");
        assert!(!tex.contains("cm\\^{}") && !tex.contains("cm\\textasciicircum"));
        assert!(
            !tex.contains("$\\sigma$h") && !tex.contains("$\\sigma$v"),
            "{what}"
        );
        assert!(tex.is_ascii(), "{what}: non-ASCII left in the LaTeX");
        let opens = tex.matches("\\begin{tabular}").count();
        assert!(opens >= 2, "{what}");
        for rule in ["\\toprule", "\\midrule", "\\bottomrule", "\\end{tabular}"] {
            assert_eq!(tex.matches(rule).count(), opens, "{what}: {rule}");
        }
        // Mulliken labels are in math mode wherever a Γ is written.
        for l in tex.lines().filter(|l| l.contains("\\Gamma")) {
            assert!(!l.contains(" A1") && !l.contains("A1'"), "{what}: {l}");
        }
    }
}

#[test]
fn the_notation_goes_into_math_mode() {
    // Mulliken (1955) label conventions; Cotton, ch. 4, class symbols.
    let cases = [
        ("A1g", "\\mathrm{A}_{1g}"),
        ("E'", "\\mathrm{E}'"),
        ("E″", "\\mathrm{E}''"),
        ("A₁′", "\\mathrm{A}_{1}'"),
        ("2E''", "2\\mathrm{E}''"),
        ("T2u", "\\mathrm{T}_{2u}"),
        ("Σg+", "\\Sigma_{g}^+"),
        ("Σg⁺", "\\Sigma_{g}^+"),
        ("Sigmau-", "\\Sigma_{u}^-"),
        ("Πu", "\\Pi_{u}"),
        ("σh", "\\sigma_h"),
        ("σᵥ", "\\sigma_v"),
        ("3σd", "3\\sigma_d"),
        ("C2'", "C_{2}'"),
        ("3C2''", "3C_{2}''"),
        ("S4^3", "S_{4}^{3}"),
        ("2C3", "2C_{3}"),
        ("2C₃", "2C_{3}"),
        ("S10", "S_{10}"),
        ("D3h", "D_{3h}"),
        ("D₃ₕ", "D_{3h}"),
        ("Td", "T_{d}"),
        ("C2v", "C_{2v}"),
        ("Γvib", "\\Gamma_{\\mathrm{vib}}"),
        ("Γ3N", "\\Gamma_{3N}"),
        ("ν1", "\\nu_{1}"),
    ];
    for (w, want) in cases {
        let got = latex::word_math(w).unwrap_or_else(|| panic!("{w} not recognized"));
        assert_eq!(got, want, "{w}");
    }
    for plain in [
        "IR", "Raman", "A", "the", "Cl", "Sb", "SbCl5", "x", "p", "dp", "vs",
    ] {
        assert_eq!(latex::word_math(plain), None, "{plain}");
    }
    for (c, want) in [
        ("C2'", "C_{2}'"),
        ("3C2(=C4^2)", "3C_{2}(=C_{4}^{2})"),
        ("sh", "\\sigma_{h}"),
        ("3sv", "3\\sigma_{v}"),
        ("S4^3", "S_{4}^{3}"),
        ("2S10", "2S_{10}"),
        ("i", "i"),
        ("2Cinf^phi", "2C_{\\infty}^{\\varphi}"),
        ("2Sinf^phi", "2S_{\\infty}^{\\varphi}"),
        ("infsv", "\\infty\\sigma_{v}"),
        ("infC2", "\\infty C_{2}"),
    ] {
        assert_eq!(report::table::latex_class(c), want, "{c}");
    }
    assert_eq!(latex::inline("380 cm⁻¹"), "380 cm$^{-1}$");
    assert_eq!(latex::inline("cm-1"), "cm$^{-1}$");
    assert_eq!(
        latex::inline("Γ = A₁′ + E′"),
        "$\\Gamma = \\mathrm{A}_{1}' + \\mathrm{E}'$"
    );
}

const NASTY: &str = "A & B: 50% of $5 #1 a_b {x} ~y ^z \\end{document}";

fn nasty_session() -> salcdesk::session::Session {
    let mut s = session::load_file(&examples()[0]).unwrap();
    s.title = NASTY.into();
    s.orientation = NASTY.into();
    s.notes = format!("{NASTY}\n\nsecond paragraph ~ ^ \\ | < >");
    s.sets[0].name = NASTY.into();
    s.bands.iter_mut().for_each(|b| b.note = NASTY.into());
    s
}

#[test]
fn the_users_text_is_escaped() {
    let s = nasty_session();
    let a = analysis::analyze(&s);
    let tex = session_report::render(&s, &a, Format::Latex, false);
    let esc = latex::escape(NASTY);
    assert_eq!(
        esc,
        "A \\& B: 50\\% of \\$5 \\#1 a\\_b \\{x\\} \\textasciitilde{}y \\textasciicircum{}z \
         \\textbackslash{}end\\{document\\}"
    );
    assert!(tex.contains(&format!("\\section*{{{esc}}}")), "{tex}");
    assert_eq!(tex.matches("\\end{document}").count(), 1);
    let md = session_report::render(&s, &a, Format::Markdown, false);
    check_markdown(&md, "nasty");
}

fn pdflatex() -> Option<PathBuf> {
    let path = std::env::var_os("PATH")?;
    std::env::split_paths(&path)
        .map(|d| d.join("pdflatex"))
        .find(|p| p.is_file())
}

fn compile(dir: &Path, name: &str, tex: &str, pdflatex: &Path) {
    let file = dir.join(format!("{name}.tex"));
    std::fs::write(&file, tex).unwrap();
    let out = Command::new(pdflatex)
        .args(["-interaction=nonstopmode", "-halt-on-error"])
        .arg(&file)
        .current_dir(dir)
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{name}: pdflatex failed:\n{}",
        String::from_utf8_lossy(&out.stdout)
            .lines()
            .filter(|l| l.starts_with('!') || l.starts_with("l."))
            .collect::<Vec<_>>()
            .join("\n")
    );
    assert!(dir.join(format!("{name}.pdf")).is_file());
}

#[test]
fn every_latex_report_compiles_with_pdflatex_when_present() {
    let Some(pdflatex) = pdflatex() else {
        eprintln!(
            "SKIPPED: pdflatex is not installed here; the LaTeX reports were not compiled \
             (install texlive-latex-base and texlive-latex-recommended to run this check)"
        );
        return;
    };
    let dir = std::env::temp_dir().join(format!("salcdesk-latex-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    for p in examples() {
        compile(
            &dir,
            &stem(&p),
            &render(&p, Format::Latex, false),
            &pdflatex,
        );
        // The fragment goes into a document of one's own.
        let s = session::load_file(&p).unwrap();
        let frag = session_report::latex_fragment(&s, &analysis::analyze(&s));
        std::fs::write(dir.join("frag.tex"), frag).unwrap();
        let host = "\\documentclass{article}\n\\usepackage{amsmath}\n\\usepackage{booktabs}\n\
                    \\usepackage[landscape,margin=1cm]{geometry}\n\
                    \\begin{document}\n\\input{frag}\n\\end{document}\n";
        compile(&dir, &format!("{}_host", stem(&p)), host, &pdflatex);
    }
    let s = nasty_session();
    let tex = session_report::render(&s, &analysis::analyze(&s), Format::Latex, false);
    compile(&dir, "nasty", &tex, &pdflatex);
    // Every shipped character table in one document.
    let mut all = String::from(
        "\\documentclass{article}\n\\usepackage{amsmath}\n\\usepackage{booktabs}\n\
         \\usepackage[landscape,margin=1cm]{geometry}\n\\begin{document}\n",
    );
    for name in salcdesk::group::names() {
        let g = salcdesk::group::load(name).unwrap();
        all.push_str(&format!(
            "\\section*{{{}}}\n\\begin{{center}}\\scriptsize\n",
            latex::escape(name)
        ));
        all.push_str(&report::table::render(&g, Format::Latex, true));
        all.push_str("\\end{center}\n");
    }
    all.push_str("\\end{document}\n");
    compile(&dir, "all_tables", &all, &pdflatex);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn the_fragment_holds_only_tables() {
    for p in examples() {
        let s = session::load_file(&p).unwrap();
        let frag = session_report::latex_fragment(&s, &analysis::analyze(&s));
        assert!(!frag.contains("\\documentclass") && !frag.contains("\\begin{document}"));
        assert!(!frag.contains("\\section") && !frag.contains("\\begin{align"));
        assert!(frag.matches("\\begin{tabular}").count() >= 2);
        for l in frag.lines().filter(|l| !l.trim().is_empty()) {
            let table_line = l.starts_with('%')
                || l.starts_with("\\begin{tabular}")
                || l.starts_with("\\end{tabular}")
                || l.ends_with("\\\\")
                || matches!(l, "\\toprule" | "\\midrule" | "\\bottomrule");
            assert!(table_line, "{}: not a table line: {l}", p.display());
        }
    }
}

#[test]
fn text_output_has_aligned_columns_not_pipes() {
    for p in examples() {
        for ascii in [false, true] {
            let t = render(&p, Format::Text, ascii);
            for l in t.lines() {
                assert!(
                    !l.trim_start().starts_with('|') && !l.contains(" | "),
                    "{}: pipe table line in text output: {l}",
                    p.display()
                );
            }
        }
    }
    let bin = env!("CARGO_BIN_EXE_salcdesk");
    let dir = env!("CARGO_MANIFEST_DIR");
    let mx5 = format!("{dir}/sessions/bipyramidal-mx5-geometry.toml");
    for args in [
        vec!["modes", "--group", "Td", "--gamma", "A1 + E + 2T2"],
        vec![
            "combos",
            "--group",
            "C3v",
            "--gamma",
            "A1 + E",
            "--nu",
            "A1 1000; E 1500",
        ],
        vec!["bands", &mx5],
        vec!["descend", "Td", "C3v", "--gamma", "A1 + E + 2T2"],
        vec!["modes", &mx5],
    ] {
        for ascii in [false, true] {
            let mut a = args.clone();
            if ascii {
                a.insert(0, "--ascii");
            }
            let out = Command::new(bin).args(&a).output().unwrap();
            assert!(out.status.success(), "{a:?}");
            let t = String::from_utf8(out.stdout).unwrap();
            assert!(!t.contains('|'), "{a:?}: pipes in text output:\n{t}");
            assert!(
                t.contains("──") || t.contains("--"),
                "{a:?}: no column rule"
            );
            if ascii {
                assert!(t.is_ascii(), "{a:?}");
            }
        }
        let mut md = args.clone();
        md.extend(["--format", "md"]);
        let out = Command::new(bin).args(&md).output().unwrap();
        let t = String::from_utf8(out.stdout).unwrap();
        assert!(t.contains("|---|"), "{md:?}: Markdown keeps its tables");
    }
}

/// A planar MX3 molecule (D3h) with the three X–X edges added as bonds: six stretches against
/// six vibrations, but the edges span A1' + E' again, so Γvib − Γstretch would be −A1' + A2''.
/// Source: explicit count — Γvib(planar MX3) = A1' + 2E' + A2'' (Nakamoto, Part A, planar XY3),
/// Γ(M–X) = Γ(X–X) = A1' + E' (three equivalent bonds on the C2 axes / edges).
const MX3_EDGES: &str = r#"format = 1
title = "Planar MX3 with its X-X edges bonded"
group = "D3h"

[geometry]
atoms = [
  { element = "Ga", xyz = [0.0, 0.0, 0.0] },
  { element = "Br", xyz = [2.25, 0.0, 0.0] },
  { element = "Br", xyz = [-1.125, 1.948557, 0.0] },
  { element = "Br", xyz = [-1.125, -1.948557, 0.0] },
]
add_bonds = [[2, 3], [3, 4], [2, 4]]
"#;

#[test]
fn no_negative_multiplicities_when_the_bonds_span_more_than_the_vibrations() {
    let s = parse("mx3-edges", MX3_EDGES).unwrap();
    let a = analysis::analyze(&s);
    for (f, ascii) in [
        (Format::Text, false),
        (Format::Text, true),
        (Format::Markdown, false),
        (Format::Latex, false),
        (Format::Json, false),
    ] {
        let out = session_report::render(&s, &a, f, ascii);
        for bad in ["= −", "+ −", "= -A", "+ -A", "= -E", "$-\\mathrm", "\"-A1"] {
            assert!(!out.contains(bad), "{f:?}: negative count {bad:?}:\n{out}");
        }
        if f != Format::Json {
            assert!(out.contains("beyond it they contain"), "{f:?}:\n{out}");
            // This centre comes out as (-0.0000, …) before rounding cleans it.
            assert!(!out.contains("-0.0000"), "{f:?}: negative zero printed");
        }
    }
    let md = session_report::render(&s, &a, Format::Markdown, false);
    assert!(
        md.contains("beyond it they contain A₁′ — combinations of the bonds"),
        "{md}"
    );
    assert!(
        md.contains("bends and other deformations span at least A₂″"),
        "{md}"
    );
}

#[test]
fn exports_refuse_what_they_cannot_write() {
    let p = |s: &str| PathBuf::from(s);
    assert_eq!(export_format(None, Some(&p("r.md"))), Ok(Format::Markdown));
    assert_eq!(export_format(None, Some(&p("r.TEX"))), Ok(Format::Latex));
    assert_eq!(export_format(None, Some(&p("r.latex"))), Ok(Format::Latex));
    assert_eq!(export_format(None, Some(&p("r.json"))), Ok(Format::Json));
    assert_eq!(export_format(None, Some(&p("r.txt"))), Ok(Format::Text));
    assert_eq!(export_format(None, Some(&p("r.text"))), Ok(Format::Text));
    assert_eq!(export_format(None, None), Ok(Format::Markdown));
    assert_eq!(
        export_format(Some(Format::Latex), Some(&p("r.pdf"))),
        Ok(Format::Latex)
    );
    for bad in ["r.pdf", "r.docx", "report", "r.html"] {
        let e = export_format(None, Some(&p(bad))).unwrap_err().to_string();
        for name in [".md", ".tex", ".latex", ".json", ".txt", ".text"] {
            assert!(e.contains(name), "{bad}: {e}");
        }
    }
    let dir = std::env::temp_dir().join(format!("salcdesk-export-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let bin = env!("CARGO_BIN_EXE_salcdesk");
    let sess = examples()[0].clone();
    let pdf = dir.join("x.pdf");
    let out = Command::new(bin)
        .args(["report"])
        .arg(&sess)
        .arg("-o")
        .arg(&pdf)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(
        err.contains(".pdf") && err.contains(".tex") && err.contains("--format"),
        "{err}"
    );
    assert!(!pdf.exists(), "nothing is written to x.pdf");
    let out = Command::new(bin)
        .args(["report", "--format", "latex"])
        .arg(&sess)
        .arg("-o")
        .arg(&pdf)
        .output()
        .unwrap();
    assert!(out.status.success());
    assert!(std::fs::read_to_string(&pdf)
        .unwrap()
        .starts_with("\\documentclass"));
    let tex = dir.join("x.tex");
    let out = Command::new(bin)
        .arg("report")
        .arg(&sess)
        .arg("-o")
        .arg(&tex)
        .arg("--fragment")
        .output()
        .unwrap();
    assert!(out.status.success());
    assert!(std::fs::read_to_string(&tex).unwrap().contains("\\toprule"));
    let _ = std::fs::remove_dir_all(&dir);
}
