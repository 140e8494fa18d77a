#pragma once
// Long lists of references, cut before OCCT parses a STEP text and put back
// whole after it: OCCT 7.6's parser takes time quadratic in a list's length
// (see long_step_list), while setting the list on the parsed entity takes
// linear time. The entity types whose lists are put back are those a
// wireframe export writes long lists in: a representation's items, a
// geometric set's elements and a presentation layer's assigned items.

#include "stepframe/geometry/step_structure.hpp"

#include <IFSelect_ReturnStatus.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <StepData_StepModel.hxx>

#include <istream>

#include <string>
#include <string_view>
#include <vector>

namespace stepframe::geometry::detail {

/// Of `lists`, those put back by restore_long_lists (by entity type and parameter).
std::vector<StepLongList> restorable_long_lists(std::vector<StepLongList> lists);

/// The text with each of `lists` (offsets into `step_text`, in text order)
/// cut to its first item, and as many line breaks after it as the list held,
/// so that the lines after it keep their numbers.
std::string cut_long_lists(std::string_view step_text, const std::vector<StepLongList>& lists);

/// Parses the (cut) text in `stream` into `parsed` as XSControl_Reader::ReadStream
/// does, the same status for the same text, but does not hand the model to the
/// reader's work session: a session that takes a model computes the graph of
/// its references (IFSelect_WorkSession::SetModel), and the cut model's graph
/// would only be thrown away when restore_long_lists hands it the whole one.
IFSelect_ReturnStatus parse_unlinked(STEPCAFControl_Reader& reader, const char* name, std::istream& stream,
                                     Handle(StepData_StepModel)& parsed);

/// After parse_unlinked: sets each list's entity's list in `model` to all its
/// items, as OCCT's reader of that entity type would have set it, and hands
/// the model to the reader's work session (which computes its graph of
/// references, on which the transfer finds its roots), as ReadStream would
/// have. False, with the session left without a model, when an entity or an
/// item is not of the type the list wants: the caller then has OCCT parse the
/// whole text, so that the file's faults are reported as OCCT reports them.
bool restore_long_lists(STEPCAFControl_Reader& reader, const Handle(StepData_StepModel)& model, const char* name,
                        const std::vector<StepLongList>& lists);

}  // namespace stepframe::geometry::detail
