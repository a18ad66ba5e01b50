// Package cif reads crystal structures from Crystallographic Information
// Files (CIF 1.1) into the point-charge model of package crystal: the full
// unit cell with one charged ion per site, ready for a lattice sum.
//
// # Syntax
//
// The tokenizer follows the CIF 1.1 syntax (S. R. Hall, F. H. Allen and
// I. D. Brown, "The Crystallographic Information File (CIF): a new
// standard archive file for crystallography", Acta Cryst. A47, 655–685
// (1991), as revised in the IUCr's CIF 1.1 syntax specification): data_
// blocks, loop_ tables, comments from '#', values unquoted, in single or
// double quotes (a quote closes only before white space, so 'a dog's life'
// is one value) or as semicolon text fields; '?' (unknown) and '.'
// (inapplicable) when unquoted; numbers with a standard uncertainty in
// parentheses, 5.4309(2), whose uncertainty is dropped. Data names are
// case-insensitive, and a '.' in a data name reads as '_' so that the DDLm
// spellings (_space_group_symop.operation_xyz) are accepted too. save_
// frames, global_ and stop_ (dictionary and STAR constructs) are refused.
//
// A file may hold several data blocks. Options.Block names the one to
// read; otherwise the first block with _atom_site_fract_x is used.
//
// # Data names read
//
// From the CIF core dictionary:
//
//   - _cell_length_a, _b, _c (Å) and _cell_angle_alpha, _beta, _gamma
//     (degrees), all required. The lattice puts a along x and b in the xy
//     plane.
//   - _cell_formula_units_Z, optional. Without it Z is the greatest common
//     divisor of the element counts in the expanded cell (Na4Cl4 → 4,
//     Ti2O4 → 2); with it, Z must divide every count, which catches a
//     symmetry list with missing operations.
//   - Symmetry operations as xyz strings (see ParseSymop) from
//     _space_group_symop_operation_xyz or the older
//     _symmetry_equiv_pos_as_xyz, looped with or without an id column. A
//     file without operations is read in P1, unless it names another space
//     group (_space_group_name_H-M_alt or _symmetry_space_group_name_H-M):
//     operations are not generated from a space-group symbol.
//   - _atom_site_label, _atom_site_type_symbol, _atom_site_fract_x, _y, _z
//     and _atom_site_occupancy. Without a type symbol the element is taken
//     from the label's leading letters ("Cl2" → Cl, "Ob" → O).
//   - _atom_type_symbol with _atom_type_oxidation_number.
//
// Every other data name is ignored.
//
// # Charges
//
// A site's charge comes, in rising order of precedence, from a type symbol
// that carries it ("Na1+", "O2-", also "Fe+3"), from the
// _atom_type_oxidation_number of its type symbol, and from
// Options.Charges, looked up by the site's label, then its type symbol,
// then its element. For Parse a site with no charge from any of these is an
// error; Read returns it with its occupants' ChargeKnown false, for package
// valence to assign.
//
// # Partial occupancy
//
// A site with _atom_site_occupancy below 1, alone or shared with other
// rows at the same position (occupancies summing to at most 1), becomes
// one site of the averaged crystal: its Occupants list the species and
// occupancies, its Charge is Σ occupancy·charge and its Species names the
// mixture ("Na0.5K0.5", "Fe0.9"). A vacancy contributes no charge.
//
// Every site is one atom: a molecular ion (OH⁻, SO₄²⁻) must be listed atom
// by atom, each with its own (formal or partial) charge.
//
// # Expansion
//
// Every operation is applied to every listed site, the images are wrapped
// into [0,1), and images of one site closer than Options.MergeTolerance
// (Å, shortest periodic distance, default 1e-3 Å) are kept once. Images of
// two different sites that close share the site when both are partly
// occupied and their occupancies sum to at most 1; otherwise they are an
// error (ErrCollision).
//
// # Refused
//
// Each of these is an *Error naming the file, line and data name:
// a syntax error; a loop whose value count is not a multiple of its data
// names (ErrMalformedLoop); missing or unknown cell data (ErrMissingCell);
// an unreadable number or symmetry operation; a type symbol or label that
// names no element of the embedded table H…Og (ErrUnknownElement); an
// occupancy not in (0, 1]; in Parse, a site without a charge (ErrMissingCharge) and a cell
// whose charges do not sum to zero (ErrNotNeutral, the message gives the
// sum and the charges per site); an atom-site loop of more than 50,000 rows,
// refused while the file is tokenised, and more than 50,000 sites after
// expansion. Values of loops the reader does not use (reflections,
// anisotropic displacements) are counted but not kept. No input makes the
// reader panic; the fuzz targets FuzzParse and FuzzParseSymop check that.
package cif
