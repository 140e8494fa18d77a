// OCCT's own read of a STEP file, as a command (the floor of the whole-run
// benchmark, started the way `stepframe run` is): STEPCAFControl_Reader
// ReadFile and Transfer into an XDE document, names only (the modes
// geometry::read_step uses), then the document closed.
// Usage: stepframe_occt_read FILE   (exit status 0 when read and transferred)

#include <STEPCAFControl_Controller.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <TDocStd_Document.hxx>
#include <XCAFApp_Application.hxx>
#include <XCAFDoc_DocumentTool.hxx>

#include <cstdio>

int main(int argc, char** argv) {
  if (argc != 2) {
    std::fprintf(stderr, "usage: stepframe_occt_read FILE\n");
    return 2;
  }
  STEPCAFControl_Controller::Init();
  STEPCAFControl_Reader reader;
  reader.SetNameMode(Standard_True);
  reader.SetLayerMode(Standard_False);
  reader.SetColorMode(Standard_False);
  reader.SetPropsMode(Standard_False);
  reader.SetGDTMode(Standard_False);
  reader.SetMatMode(Standard_False);
  reader.SetViewMode(Standard_False);
  if (reader.ReadFile(argv[1]) != IFSelect_RetDone) return 1;
  Handle(TDocStd_Document) document;
  XCAFApp_Application::GetApplication()->NewDocument("MDTV-XCAF", document);
  XCAFDoc_DocumentTool::SetLengthUnit(document, 1e-3);
  if (!reader.Transfer(document)) return 1;
  XCAFApp_Application::GetApplication()->Close(document);
  return 0;
}
