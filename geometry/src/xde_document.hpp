#pragma once
// An XDE document (shapes with names, layers, colours) that is closed however
// the function that opened it leaves.

#include <TDocStd_Document.hxx>
#include <XCAFApp_Application.hxx>

namespace stepframe::geometry::detail {

class XdeDocument {
 public:
  XdeDocument() : application_(XCAFApp_Application::GetApplication()) {
    application_->NewDocument("MDTV-XCAF", document_);
  }
  XdeDocument(const XdeDocument&) = delete;
  XdeDocument& operator=(const XdeDocument&) = delete;
  ~XdeDocument() {
    if (!document_.IsNull()) application_->Close(document_);
  }

  Handle(TDocStd_Document) & get() { return document_; }

 private:
  Handle(XCAFApp_Application) application_;
  Handle(TDocStd_Document) document_;
};

}  // namespace stepframe::geometry::detail
