#include "stepframe/model_source.hpp"

#include "stepframe/geometry/occt_sources.hpp"

#include <TDocStd_Document.hxx>
#include <TopoDS_Shape.hxx>

namespace stepframe {
namespace {

template <class... Ts>
struct overloaded : Ts... {
  using Ts::operator()...;
};
template <class... Ts>
overloaded(Ts...) -> overloaded<Ts...>;

}  // namespace

std::string describe(const ModelSource& source) {
  return std::visit(overloaded{[](const StepFile& s) { return s.path.string(); },
                               [](const StepText& s) { return s.display_name; },
                               [](const ShapeModel& s) {
                                 return s.attributes ? s.attributes->display_name : std::string("<shape>");
                               },
                               [](const XdeDocument& s) { return s.display_name; }},
                    source);
}

geometry::StepModel read_model_source(const ModelSource& source) {
  return std::visit(
      overloaded{[](const StepFile& s) { return geometry::read_step(s.path); },
                 [](const StepText& s) { return geometry::read_step_text(s.text, s.display_name); },
                 [](const ShapeModel& s) {
                   const geometry::ShapeAttributes none;
                   const auto& attributes = s.attributes ? *s.attributes : none;
                   if (!s.shape)
                     throw geometry::StepReadError(attributes.display_name +
                                                   ": no shape was given; pass the OCCT shape to analyse");
                   return geometry::read_shape(*s.shape, attributes);
                 },
                 [](const XdeDocument& s) {
                   // The document lives in an OCCT handle elsewhere: this one only shares it for the call.
                   const Handle(TDocStd_Document) document(const_cast<TDocStd_Document*>(s.document));
                   return geometry::read_xde_document(document, s.display_name);
                 }},
      source);
}

}  // namespace stepframe
