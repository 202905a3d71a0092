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
//   - The flooding run (f, then t to show or hide it): the selected
//     compartment filling through a hole against its pumps, over time
//     (engine.FloodRun), with the rest of the damage state as the dashboard
//     has it. A small form at the foot of the screen takes the hole's area
//     (m²), the height of its centre (z, m above the baseline), its
//     discharge coefficient C_d and the pumps (m³/h), filled from the
//     vessel file (its hole and pump_m3h for that compartment) or, where
//     the file gives no hole, a shell hole of 0.05 m² at the compartment's
//     lowest point (engine.ShellHole); the file's hole keeps its position
//     while its height is left as it is, any other height puts the hole in
//     the shell at mid-length, outboard. Tab moves between the fields,
//     enter starts, esc cancels; a bad value is refused with a sentence and
//     the cursor stays on it. While the run computes the panel shows a
//     progress bar, the flooding time reached, the water in and the head,
//     and the water plotted so far. When it is done: the end in a sentence
//     (levels equal, pumps holding and at what level and sounding, full,
//     she sinks or capsizes, time limit), every event with its time from
//     the hole and the water in then (d deck edge, m margin line on a
//     passenger ship only, o an
//     opening, c a criterion failing, » the end), which of the deck edge
//     and the margin line stayed clear, the stages at 25, 50 and 75 % of
//     the final water and the end (when reached, heel, GM, the deck edge's
//     freeboard where there is room, and the criteria), and a plot against
//     time of the heel (solid, scale on the left) and the water in the
//     compartment (dotted, scale on the right) with the events marked by
//     their letters. On a narrow screen the panel takes the right-hand
//     column (the plot where it has room); from 120×40 it takes the place
//     of the profile and the GZ curve, beside the section. The stage key s
//     puts the run's stages on the dashboard one after another (an ordinary
//     change, undone with u): the compartment holds that stage's water as
//     an added weight, the list says "part" and the section and the profile
//     shade its water up to its free surface (engine.Position.Held), and
//     the stage's row in the panel is highlighted. When the damage state
//     changes otherwise after a run the panel says so.
//   - The righting options (o): what engine.FindRemedies works out for the
//     damage state shown, on request, in a panel that takes the body of
//     the screen under the header. First, plainly, whether the heel is a
//     list or a loll, with the upright GM; in a loll, in the danger style,
//     not to counter-ballast the high side. Then the options ranked best
//     first, one row each: the action, the mass, the heel she comes to with
//     its side, GM where she lies, the least freeboard to the deck edge
//     (from 110 columns also the upright GM and the lowest unprotected
//     opening's height) and whether it is advisable; their notes under the
//     table, and the engine's summary in full (above the table on a wide
//     screen, after the notes on a narrow one). What does not fit scrolls
//     with [ ]; the foot of the panel, always in view, says they are
//     options to weigh, not orders. A change of the damage state does not
//     work them out again (the engine's search is on demand, up to 48
//     solves): the panel shows no option, says they are out of date, and o
//     works them out for the state now; undone back to the state they were
//     worked out for, they are current again. The report key includes them
//     when they are current, and each result goes into the event log. The
//     flooding-run panel and the righting options take turns: t brings the
//     run's panel back, and starting a run puts it in place of the options.
//
// The smallest screen is 80×24; below it the screen says what it needs.
//
// # Keys
//
// Every key is in the keyMap (keys.go), and the help bar and the full help
// (?) are drawn from it:
//
//	↑ k, ↓ j           move through the compartment list
//	home g pgup        the first compartment
//	end G pgdown       the last compartment
//	space, enter       open the selected compartment to the sea, or close it
//	                   up (intact; a partly flooded one is emptied)
//	+ =, − _           its permeability μ up or down by 0.05 (0.05 … 1)
//	m                  type an exact permeability (0.85, ,85 or 85%)
//	u, ctrl+z          undo the last change
//	R                  all compartments intact
//	tab, v             the next picture: section, profile, GZ curve,
//	                   criteria (narrow screens only)
//	h                  the hand method's working shown or hidden
//	[ ]                scroll the righting options, the hand working, or
//	                   the flags and criteria
//	w                  write the Markdown report of the state shown
//	f                  flooding run: the hole-and-pumps form for the
//	                   selected compartment (in the form: tab, shift+tab,
//	                   ↑ ↓ move between fields, enter starts, esc cancels)
//	t                  the flooding-run panel shown or hidden; hiding it
//	                   stops a run still computing
//	s                  the run's next stage onto the dashboard as water held
//	                   (once a run has finished)
//	o                  the righting options worked out for the state shown
//	                   and their panel shown; again on current options, the
//	                   panel hidden
//	c                  palette: day, night, mono
//	?                  all keys, or back to the short help bar
//	q, ctrl+c          quit
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
// shows a computing mark. A flooding run works the same way with a sequence
// number of its own: each Cmd takes one step of the run
// (engine.FloodRun.Step) and hands the run back in its message, and Update,
// which never calls the run, issues the next step; so the run, which is not
// safe for concurrent use, is held by one Cmd at a time, the screen stays
// live between steps, and a newer run or hiding the panel stops an older one
// at its next step (its messages are dropped). The last Cmd works out the
// report (engine.FloodRun.Report). The righting options have a sequence
// number of their own too: each request's Cmd calls engine.FindRemedies on
// a copy of the damage state and only the newest request's options are
// kept; while it computes, the panel's title carries the computing mark,
// and a report asked for meanwhile waits for them. All of these Cmds are
// made by one function, newest (newest.go).
//
// Keys go where one mode value sends them: the list and panels, the
// flooding run's form, or a typed permeability. The form, the flooding
// run's panel (floodPanel), the righting options' panel (remedyPanel) and
// the hand working are child models with their own update and view; the
// root routes their keys and messages to them and keeps only what they
// share (the vessel, the damage state, the log, the styles). A panel asks
// the root for a line in the log or a change of the damage state through
// host (host.go), during its update and in order. View draws only: the screen is divided once at the
// end of every Update (resize); the pictures are drawn again only when
// their data, the selection, the palette or their size changed
// (picture_cache.go); every scroll is kept within its text by bubbles'
// viewport (scroll.go); and every figure went through num (report's
// words), which prints "—" for a value that is not a finite number.
//
// Palettes are values built by newStyles: day, night (dim reds only, for a
// dark bridge) and mono (NO_COLOR forces it). Every state has a mark or a
// word of its own, so nothing depends on colour alone.
package tui
