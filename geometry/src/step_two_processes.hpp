#pragma once
// Reading a large wireframe's STEP text in two processes at once: OCCT's reader uses one core and is not
// thread-safe, so this process reads the first half of the members (step_split.hpp) while a child
// process, made with fork(), reads the other half and sends its model back through a pipe; the two
// models are joined into what reading the whole text gives.

#include "stepframe/geometry/step_reader.hpp"

#include <cstddef>
#include <functional>
#include <optional>
#include <string_view>

namespace stepframe::geometry::detail {

/// Reads one part's text as the whole text would be read (same source name, same rewrites).
using PartReader = std::function<StepModel(std::string_view part_text)>;

/// The model of `text` read in two processes, or nullopt when it cannot be had that way exactly, for
/// the caller to read the whole text instead: the text is not split (step_split_part), either part
/// fails to read, the child does not answer in time, or the parts' findings differ (a finding about a
/// member, such as a zero-length edge, is reported in the order the whole read gives only by the whole
/// read). The child logs nothing; the messages OCCT gave it are logged here as OCCT's own are.
/// Only for a process with no other thread that may hold a lock when it forks (the command line).
std::optional<StepModel> read_in_two_processes(std::string_view text, std::size_t min_members,
                                               const PartReader& read_part);

}  // namespace stepframe::geometry::detail
