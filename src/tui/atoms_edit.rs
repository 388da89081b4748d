//! Members tied to atoms, from the workspace: a new member set made from the geometry (its
//! bond, angle, atom and ligand sets, offered in a picker) and the atoms of one member given or
//! changed in place. Each is one undoable edit, saved as `[set.atoms]`.

use super::app::{App, FieldPurpose};
use super::picker::{PickFor, Picker};
use crate::analysis::atom_sets;
use crate::session::MemberSet;

impl App {
    /// The surveyed geometry of the shown analysis, or why there is none.
    fn survey_now(&self) -> Result<std::sync::Arc<crate::survey::Survey>, String> {
        let a = self.analysis.as_ref().map_err(|e| e.to_string())?;
        atom_sets::usable(a.geometry.as_ref())?;
        a.geometry
            .as_ref()
            .and_then(|g| g.survey.as_ref().ok().cloned())
            .ok_or_else(|| "no geometry".to_string())
    }

    /// `A` in Members: offer the geometry's sets in a picker.
    pub(super) fn member_set_picker(&mut self) {
        let sv = match self.survey_now() {
            Ok(sv) => sv,
            Err(e) => return self.error(format!("no sets to take from the geometry: {e}")),
        };
        let Ok(a) = &self.analysis else { return };
        let offers = atom_sets::offers(&sv, &a.group);
        if offers.is_empty() {
            return self.status("the geometry offers no sets (no atoms?)");
        }
        let mut notes = vec![format!(
            "Sets of symmetry-equivalent members in the geometry ({}): the new set's members \
             name their atoms and take the geometry's ticks.",
            sv.group.name()
        )];
        if sv.group.name() != a.group.name() {
            notes.push(format!(
                "The session's group is {}, not the geometry's {}: the new members get only E \
                 ticked.",
                a.group.name(),
                sv.group.name()
            ));
        }
        self.open_picker(Picker {
            title: "New member set from the geometry".into(),
            notes,
            items: offers.iter().map(|o| o.description.clone()).collect(),
            cursor: 0,
            purpose: PickFor::MemberSet(offers.into_iter().map(|o| o.set).collect()),
        });
    }

    pub(super) fn member_set_chosen(&mut self, sets: Vec<MemberSet>, k: usize) {
        let Some(mut set) = sets.into_iter().nth(k) else {
            return;
        };
        let base = set.name.clone();
        let mut n = 2;
        while self.session.sets.iter().any(|s| s.name == set.name) {
            set.name = format!("{base} ({n})");
            n += 1;
        }
        let (name, count) = (set.name.clone(), set.members.len());
        self.edit(|s| s.sets.push(set));
        self.members_ui.set = self.session.sets.len() - 1;
        self.members_ui.row = 0;
        self.status(format!(
            "new set {name}: {count} members tied to atoms, ticks from the geometry (u undoes)"
        ));
    }

    /// `@` in Members: type the atoms of the member under the cursor.
    pub(super) fn member_atoms_prompt(&mut self) {
        let Some(set) = self.session.sets.get(self.members_ui.set) else {
            return self.status("no member set yet: n starts one, A makes one from the geometry");
        };
        let Some(m) = set.members.get(self.members_ui.row) else {
            return self.status("this set has no members yet: a adds one");
        };
        if let Err(e) = self.survey_now() {
            return self.error(format!("members are tied to the geometry's atoms: {e}"));
        }
        let now = m
            .atoms
            .as_ref()
            .map(|a| {
                a.iter()
                    .map(|n| n.to_string())
                    .collect::<Vec<_>>()
                    .join("-")
            })
            .unwrap_or_default();
        let eg = match set.kind.atoms_per_member() {
            2 => "e.g. 1-2",
            3 => "end-apex-end, e.g. 2-1-3",
            _ => "e.g. 4",
        };
        let label = format!("Atoms of {} ({eg}; none unties)", m.name);
        self.ask_field(FieldPurpose::MemberAtoms, &label, now);
    }

    pub(super) fn member_atoms_done(&mut self, text: &str) {
        let (si, mi) = (self.members_ui.set, self.members_ui.row);
        let Some(set) = self.session.sets.get(si) else {
            return;
        };
        let Some(m) = set.members.get(mi) else { return };
        let name = m.name.clone();
        let kind = set.kind;
        if text.eq_ignore_ascii_case("none") {
            self.edit(|s| s.sets[si].members[mi].atoms = None);
            return self.status(format!("{name} names no atoms now (u undoes)"));
        }
        let sv = match self.survey_now() {
            Ok(sv) => sv,
            Err(e) => return self.error(e),
        };
        let atoms = match atom_sets::parse_atoms(text)
            .and_then(|a| atom_sets::check_member_atoms(&sv, kind, &a).map(|_| a))
        {
            Ok(a) => a,
            Err(e) => return self.error(format!("{name} unchanged: {e}")),
        };
        let Ok(a) = self.analysis.clone() else { return };
        let ticks = atom_sets::ticks_for(&sv, &a.group, kind, &atoms);
        let same_group = sv.group.name() == a.group.name();
        let legend = atom_sets::member_legend(&sv, &atoms);
        self.edit(|s| {
            let m = &mut s.sets[si].members[mi];
            m.atoms = Some(atoms);
            if same_group {
                m.unmoved_by = ticks;
            }
        });
        let ticks_note = if same_group {
            "; ticks from the geometry"
        } else {
            ""
        };
        self.status(format!("{name} = {legend}{ticks_note} (u undoes)"));
    }
}
