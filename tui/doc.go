// Package tui is heelwatch's flooding dashboard: one terminal screen on
// which an officer marks compartments open to the sea, or changes their
// permeability, and sees at once where the ship floats, how much margin is
// left and what has stopped being safe.
//
// # The screen
//
//   - The compartment list, grouped as the vessel file groups them (or by
//     thirds of the length when it does not): name, use when there is room,
//     permeability μ and state (intact, OPEN to the sea, part flooded). Open
//     spaces carry ■; ▲ marks the intact compartment next at risk and ‼ one
//     whose opening is already under water. Three lines under the list
//     describe the selected compartment.
//   - The floating position: drafts aft, amidships and forward, heel with its
//     side, trim with its sense, GM, displacement, the least freeboard to the
//     deck edge and where, and the unprotected opening nearest to immersion
//     with its height; each with its change since the intact condition. A
//     figure that is bad news in itself (deck edge or opening under water, GM
//     gone) is marked ‼ as well as coloured.
//   - The flags with their sentences, most severe first (‼ danger, ! caution,
//     · for the record), and the criteria with pass or FAIL, the value found,
//     the limit and the margin.
//   - Pictures in braille dots with labelled scales: the transverse section at
//     the selected compartment, looking forward, with the heeled waterline
//     dashed and the flooded spaces shaded ░; the profile seen from the side
//     she lies to, with the waterline at that side, the deck line and the
//     openings (○ clear, ● under water, ◇ weathertight); the GZ curve with
//     the angle she lies at (e), the downflooding angle (f), the angle of
//     vanishing stability (v) and the range between e and v drawn under the
//     axis. From 120×40 the three stand side by side; on a smaller screen one
//     at a time, turned with tab.
//   - The hand method (lost buoyancy, small angles): its answers beside the
//     direct ones and its working step by step, shown and hidden with h; or
//     why it does not apply.
//   - The event log: every change with its time and the resulting heel and
//     drafts; with Options.LogFile the same lines are appended to the file
//     and synced as they happen.
//
// The smallest screen is 80×24; below it the screen says what it needs.
//
// # "Next at risk"
//
// An opening leads into the compartment whose plan (x, y) holds it, whose
// bottom is below it, and whose top is highest (the space under a vent or
// behind a door). Of the intact compartments reached so, the one whose
// opening is nearest the water is next at risk. This is the screen's own rule
// for drawing the eye; the vessel file does not say which space an opening
// serves.
//
// # How it works
//
// One model (bubbletea), its parts held as concrete values. Every change of
// the damage state gets a sequence number; the assessment (engine.Assess)
// runs in a tea.Cmd and comes back as a message carrying that number, and
// only the newest number's result is shown, so an older keystroke's result
// never overwrites a newer one; a Cmd whose change was superseded before it
// started does not compute at all. While a result is pending the header
// shows a computing mark. View draws only: every size is decided in one
// WindowSizeMsg handler (resize) and every figure went through num, which
// prints "—" for a value that is not a finite number.
//
// Palettes are values built by newStyles: day, night (dim reds only, for a
// dark bridge) and mono (NO_COLOR forces it). Every state has a mark or a
// word of its own, so nothing depends on colour alone.
package tui
