use super::*;

#[test]
fn c3v_from_text_validates() {
    let text = include_str!("../../tables/C3v.toml");
    let g = PointGroup::from_toml("C3v.toml", text).unwrap();
    assert_eq!(g.order(), 6);
    let p = validate::validate(&g);
    assert!(p.is_empty(), "{p:#?}");
}
