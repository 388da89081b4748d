//! Hostile inputs, table-driven: each must give a clear message with its location (where there
//! is a file), a non-zero exit, no panic, and finish in bounded time and memory (run under a
//! 10 s limit and a 4 GiB address-space limit).

use std::io::Write;
use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};
use std::time::{Duration, Instant};

struct Case {
    name: &'static str,
    /// Command-line arguments; `{f}` is replaced by the path of the input file.
    args: &'static [&'static str],
    /// File content (written to a file named after the case), if any.
    file: Option<Vec<u8>>,
    /// Extension of that file.
    ext: &'static str,
    /// Text the error message must contain.
    expect: &'static str,
}

fn case(
    name: &'static str,
    args: &'static [&'static str],
    file: Option<&[u8]>,
    ext: &'static str,
    expect: &'static str,
) -> Case {
    Case {
        name,
        args,
        file: file.map(|b| b.to_vec()),
        ext,
        expect,
    }
}

fn scratch() -> PathBuf {
    let d = std::env::temp_dir().join(format!("salcdesk-hostile-{}", std::process::id()));
    std::fs::create_dir_all(&d).unwrap();
    d
}

fn run_limited(args: &[String], stdin: &[u8]) -> (Option<i32>, String, String, Duration) {
    let start = Instant::now();
    let mut child = Command::new("bash")
        .arg("-c")
        .arg("ulimit -v 4194304; exec \"$@\"")
        .arg("_")
        .arg(env!("CARGO_BIN_EXE_salcdesk"))
        .args(args)
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    let _ = child.stdin.take().unwrap().write_all(stdin);
    loop {
        if let Some(_status) = child.try_wait().unwrap() {
            break;
        }
        if start.elapsed() > Duration::from_secs(10) {
            let _ = child.kill();
            panic!("{args:?} ran longer than 10 s");
        }
        std::thread::sleep(Duration::from_millis(10));
    }
    let out = child.wait_with_output().unwrap();
    (
        out.status.code(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
        start.elapsed(),
    )
}

fn check(c: &Case, dir: &Path) {
    let path = dir.join(format!("{}.{}", c.name, c.ext));
    if let Some(bytes) = &c.file {
        std::fs::write(&path, bytes).unwrap();
    }
    let args: Vec<String> = c
        .args
        .iter()
        .map(|a| a.replace("{f}", path.to_str().unwrap()))
        .collect();
    let (code, _out, err, _t) = run_limited(&args, b"");
    assert!(
        code.is_some_and(|c| c != 0),
        "{}: exit {code:?}, stderr {err}",
        c.name
    );
    assert!(!err.contains("panicked"), "{}: panic: {err}", c.name);
    assert!(
        err.to_lowercase().contains(&c.expect.to_lowercase()),
        "{}: message {err:?} lacks {:?}",
        c.name,
        c.expect
    );
}

fn xyz_cases() -> Vec<Case> {
    let a: &[&str] = &["analyze", "{f}"];
    let mut huge_line = b"1\nx\nC 0 0 ".to_vec();
    huge_line.extend(std::iter::repeat_n(b'9', 5000));
    let mut many_blank = b"2\nx\nC 0 0 0\n".to_vec();
    many_blank.extend(std::iter::repeat_n(b'\n', 100_000));
    vec![
        case("xyz_empty", a, Some(b""), "xyz", ":1:1"),
        case(
            "xyz_binary",
            a,
            Some(&[0u8, 159, 146, 150, 0, 1, 2, 255, 254, 10, 13]),
            "xyz",
            "UTF-8",
        ),
        case(
            "xyz_non_utf8_comment",
            a,
            Some(b"1\n\xff\xfe\nC 0 0 0\n"),
            "xyz",
            ":2:",
        ),
        case(
            "xyz_huge_count",
            a,
            Some(b"999999999999\nx\nC 0 0 0\n"),
            "xyz",
            "exceeds",
        ),
        case(
            "xyz_count_overflow",
            a,
            Some(b"99999999999999999999999999\nx\n"),
            "xyz",
            ":1:",
        ),
        case("xyz_negative_count", a, Some(b"-3\nx\n"), "xyz", ":1:"),
        case("xyz_nan", a, Some(b"1\nx\nC nan 0 0\n"), "xyz", ":3:"),
        case("xyz_inf", a, Some(b"1\nx\nC 0 0 inf\n"), "xyz", ":3:"),
        case(
            "xyz_duplicate_atoms",
            a,
            Some(b"2\nx\nC 0 0 0\nC 0 0 0\n"),
            "xyz",
            "duplicated",
        ),
        case(
            "xyz_atoms_1e-9_apart",
            a,
            Some(b"2\nx\nC 0 0 0\nC 0 0 1e-9\n"),
            "xyz",
            "apart",
        ),
        case(
            "xyz_1e12_coordinates",
            a,
            Some(b"2\nx\nC 0 0 0\nC 0 0 1e12\n"),
            "xyz",
            "1e6",
        ),
        case(
            "xyz_unknown_element",
            a,
            Some(b"1\nx\nXx 0 0 0\n"),
            "xyz",
            ":3:",
        ),
        case(
            "xyz_atomic_number_0",
            a,
            Some(b"1\nx\n0 0 0 0\n"),
            "xyz",
            ":3:",
        ),
        case(
            "xyz_atomic_number_200",
            a,
            Some(b"1\nx\n200 0 0 0\n"),
            "xyz",
            ":3:",
        ),
        case(
            "xyz_count_mismatch",
            a,
            Some(b"3\nx\nC 0 0 0\nH 1 0 0\n"),
            "xyz",
            "xyz:",
        ),
        case(
            "xyz_truncated_line",
            a,
            Some(b"2\nx\nC 0 0 0\nH 1 0"),
            "xyz",
            ":4:",
        ),
        case(
            "xyz_text_coordinate",
            a,
            Some(b"1\nx\nC zero 0 0\n"),
            "xyz",
            ":3:",
        ),
        case("xyz_missing_comment", a, Some(b"1\n"), "xyz", ":"),
        case("xyz_huge_number_token", a, Some(&huge_line), "xyz", ":3:"),
        case(
            "xyz_trailing_blank_flood",
            a,
            Some(&many_blank),
            "xyz",
            "xyz",
        ),
        case(
            "xyz_missing_file",
            &["analyze", "/nonexistent/dir/none.xyz"],
            None,
            "xyz",
            "none.xyz",
        ),
        case(
            "xyz_bad_frame",
            &["analyze", "--frame", "7", "{f}"],
            Some(b"1\nx\nC 0 0 0\n"),
            "xyz",
            "frame",
        ),
        case(
            "xyz_bad_tolerance",
            &["analyze", "--tol", "-1", "{f}"],
            Some(b"1\nx\nC 0 0 0\n"),
            "xyz",
            "tol",
        ),
        case(
            "xyz_nan_tolerance",
            &["detect", "--tol", "NaN", "{f}"],
            Some(b"1\nx\nC 0 0 0\n"),
            "xyz",
            "tolerance",
        ),
        case(
            "symmetrize_wrong_group",
            &["symmetrize", "--group", "Oh", "{f}"],
            Some(b"3\nw\nO 0 0 0.1173\nH 0 0.7572 -0.4692\nH 0 -0.7572 -0.4692\n"),
            "xyz",
            "not Oh",
        ),
    ]
}

fn table_and_number_cases() -> Vec<Case> {
    vec![
        case("unknown_group", &["table", "C42v"], None, "", "unknown point group"),
        case("unknown_group_reduce", &["reduce", "Xy", "1"], None, "", "unknown point group"),
        case("wrong_number_of_characters", &["reduce", "C3v", "3", "1"], None, "", "3 classes"),
        case("character_not_a_number", &["reduce", "C2v", "9", "minus one", "3", "1"], None, "", "value 2"),
        case("character_bad_function", &["reduce", "C2v", "9", "cos(2)", "3", "1"], None, "", "pi"),
        case("character_division_by_zero", &["reduce", "C2v", "9", "1/0", "3", "1"], None, "", "zero"),
        case("character_sqrt_huge_field", &["reduce", "C2v", "9", "sqrt(1999)", "3", "1"], None, "", "roots of unity"),
        case("character_product_of_far_roots", &["reduce", "C2v", "9", "exp(2pi i/97)*exp(2pi i/89)", "3", "1"], None, "", "roots of unity"),
        case("character_angle_denominator", &["reduce", "C2v", "9", "2cos(2pi/997)", "3", "1"], None, "", "angle too complicated"),
        case("character_huge_power", &["reduce", "C2v", "9", "2^999999", "3", "1"], None, "", "exponent"),
        case("impossible_characters", &["reduce", "C3v", "3", "0", "2"], None, "", "not a representation"),
        case("negative_unmoved", &["reduce", "Td", "--unmoved", "5", "-2", "1", "1", "3"], None, "", "negative"),
        case("unknown_kind", &["reduce", "Td", "--unmoved", "5", "2", "1", "1", "3", "--kind", "spin"], None, "", "kind"),
        case("unknown_irrep", &["product", "Oh", "T1u", "T7g"], None, "", "not an irrep"),
        case("unknown_format", &["table", "C2v", "--format", "pdf"], None, "", "format"),
        case("table_newer_format", &["check-table", "{f}"], Some(b"format = 9\nname = \"X\"\nsymbol = \"X\"\nfamily = \"Cn\"\norientation = \"\"\n[[class]]\nsymbol = \"E\"\nascii = \"E\"\nsize = 1\nop = { kind = \"identity\" }\n[[irrep]]\nlabel = \"A\"\nchars = [\"1\"]\n"), "toml", "newer"),
        case("table_truncated", &["check-table", "{f}"], Some(b"format = 1\nname = \"C2\"\n[[class]]\nsymbol = "), "toml", ".toml:"),
        case("table_not_toml", &["check-table", "{f}"], Some(b"\x00\x01\x02 not toml"), "toml", ".toml"),
        case("table_bad_character", &["check-table", "{f}"], Some(b"format = 1\nname = \"X\"\nsymbol = \"X\"\nfamily = \"Cn\"\norder = 1\norientation = \"\"\n[[class]]\nsymbol = \"E\"\nascii = \"E\"\nsize = 1\nop = { kind = \"identity\" }\n[[irrep]]\nlabel = \"A\"\nchars = [\"one\"]\n"), "toml", ".toml:14:"),
        case("table_wrong_group", &["check-table", "{f}"], Some(b"format = 1\nname = \"X\"\nsymbol = \"X\"\nfamily = \"Cn\"\norder = 2\norientation = \"\"\n[[class]]\nsymbol = \"E\"\nascii = \"E\"\nsize = 1\nop = { kind = \"identity\" }\n[[class]]\nsymbol = \"C3\"\nascii = \"C3\"\nsize = 1\nop = { kind = \"rotation\", axis = [\"0\",\"0\",\"1\"], turn = \"1/3\" }\n[[irrep]]\nlabel = \"A\"\nchars = [\"1\", \"1\"]\n[[irrep]]\nlabel = \"B\"\nchars = [\"1\", \"-1\"]\n"), "toml", "operations"),
        case("bands_missing_file", &["bands", "--group", "Td", "--gamma", "A1", "--bands", "/nonexistent/b.csv"], None, "", "b.csv"),
        case("bands_garbage", &["bands", "--group", "Td", "--gamma", "A1", "--bands", "{f}"], Some(b"459 Raman\nabc def\n"), "csv", "2"),
        case("gamma_unknown_irrep", &["modes", "--group", "Td", "--gamma", "A1 + Q9"], None, "", "Q9"),
        case("descend_not_a_subgroup", &["descend", "Td", "D6h"], None, "", "D6h"),
    ]
}

fn session_and_molecule_cases() -> Vec<Case> {
    const W: &[u8] = b"3\nw\nO 0 0 0.1173\nH 0 0.7572 -0.4692\nH 0 -0.7572 -0.4692\n";
    vec![
        case("session_newer_format", &["report", "{f}"], Some(b"format = 99\ntitle = \"from the future\"\n"), "toml", "newer"),
        case("session_truncated", &["report", "{f}"], Some(b"format = 1\ngroup = \"C3v\"\n[[set]]\nname = "), "toml", ".toml:4:"),
        case("session_binary", &["report", "{f}"], Some(b"\xff\xfe\x00binary"), "toml", ".toml"),
        case("session_bond_triple", &["report", "{f}"], Some(b"format = 1\n[geometry]\natoms = [{ element = \"H\", xyz = [0, 0, 0] }]\nadd_bonds = [[1, 2, 3]]\n"), "toml", ".toml:4:"),
        case("session_bond_atom_zero", &["report", "{f}"], Some(b"format = 1\n[geometry]\natoms = [{ element = \"H\", xyz = [0, 0, 0] }]\nremove_bonds = [[0, 1]]\n"), "toml", "count from 1"),
        case("session_bond_missing_atom", &["report", "{f}"], Some(b"format = 1\ngroup = \"Cinfv\"\n[geometry]\natoms = [{ element = \"H\", xyz = [0, 0, 0] }, { element = \"F\", xyz = [0, 0, 0.92] }]\nadd_bonds = [[1, 7]]\n"), "toml", "atom 7 does not exist"),
        case("session_unknown_element", &["report", "{f}"], Some(b"format = 1\n[geometry]\natoms = [{ element = \"Qq\", xyz = [0, 0, 0] }]\n"), "toml", "Qq"),
        case("analyze_bond_syntax", &["analyze", "--add-bond", "1to2", "{f}"], Some(W), "xyz", "1to2"),
        case("analyze_bond_out_of_range", &["analyze", "--add-bond", "1-9", "{f}"], Some(W), "xyz", "atom 9"),
        case("analyze_bond_breaks_symmetry", &["analyze", "--remove-bond", "1-2", "{f}"], Some(W), "xyz", "not symmetric"),
        case("build_unknown_site", &["build", "Td", "--sites", "C@origin H@axis7:1.1"], None, "", "item 2"),
        case("build_linear_group", &["build", "Dinfh", "--sites", "C@origin"], None, "", "linear"),
        case("build_negative_distance", &["build", "Oh", "--sites", "Cl@axis1:-2"], None, "", "item 1"),
    ]
}

#[test]
fn hostile_inputs_fail_cleanly() {
    let dir = scratch();
    let cases: Vec<Case> = xyz_cases()
        .into_iter()
        .chain(table_and_number_cases())
        .chain(session_and_molecule_cases())
        .collect();
    assert!(cases.len() >= 40, "{} cases", cases.len());
    for c in &cases {
        check(c, &dir);
    }
}
