#pragma once
// A StepModel as bytes and back, for a child process that read part of a STEP file to hand its model to
// the parent (step_two_processes.hpp). Both ends are the same program on the same machine: numbers
// travel as their bytes in memory, bit for bit.

#include "stepframe/geometry/step_reader.hpp"

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::geometry::detail {

/// What a child process sends: the model it read and the messages OCCT gave on the way.
struct ModelWithMessages {
  StepModel model;
  std::vector<std::string> occt_messages;
};

std::string to_bytes(const ModelWithMessages& read);
/// nullopt when `bytes` is not a whole message made by to_bytes.
std::optional<ModelWithMessages> from_bytes(std::string_view bytes);

}  // namespace stepframe::geometry::detail
