// addin.cpp - what Calc asks the add-in about itself: XAddIn (names,
// descriptions, categories, all from the catalog), XServiceName,
// XServiceInfo, and the factory named in tallyrates.components.
#include "addin.hpp"

#include <com/sun/star/uno/XComponentContext.hpp>
#include <cppuhelper/supportsservice.hxx>

#include "catalog.hpp"
#include "guard.hpp"

namespace tallyrates::uno {

namespace {

const catalog::function* find(const OUString& name) { return catalog::by_programmatic(utf8(name)); }

// Calc numbers the arguments as the IDL does, counting the hidden first one
// (the calling document, which the wizard never shows and the catalog does
// not list). Measured in LibreOffice 7.4: index 1 is the first visible one.
constexpr sal_Int32 hidden_arguments = 1;

const catalog::argument* argument(const OUString& name, sal_Int32 index) {
    const auto* f = find(name);
    const sal_Int32 k = index - hidden_arguments;
    if (!f || k < 0 || static_cast<std::size_t>(k) >= f->arguments.size()) return nullptr;
    return &f->arguments[static_cast<std::size_t>(k)];
}

}  // namespace

OUString rates::getProgrammaticFuntionName(const OUString& display) {
    const auto* f = catalog::by_display(utf8(display));
    return f ? ou(f->programmatic) : OUString();
}
OUString rates::getDisplayFunctionName(const OUString& name) {
    const auto* f = find(name);
    return f ? ou(f->display) : OUString();
}
OUString rates::getFunctionDescription(const OUString& name) {
    const auto* f = find(name);
    return f ? ou(f->description) : OUString();
}
OUString rates::getDisplayArgumentName(const OUString& name, sal_Int32 index) {
    const auto* a = argument(name, index);
    return a ? ou(a->name) : OUString();
}
OUString rates::getArgumentDescription(const OUString& name, sal_Int32 index) {
    const auto* a = argument(name, index);
    return a ? ou(catalog::argument_text(*a)) : OUString();
}
OUString rates::getProgrammaticCategoryName(const OUString&) { return ou(catalog::category); }
OUString rates::getDisplayCategoryName(const OUString&) { return ou(catalog::category); }

// XLocalizable (through XAddIn): one language so far.
void rates::setLocale(const css::lang::Locale& locale) {
    std::lock_guard lock(mutex_);
    locale_ = locale;
}
css::lang::Locale rates::getLocale() {
    std::lock_guard lock(mutex_);
    return locale_;
}

OUString rates::getServiceName() { return ou(catalog::service_name); }
OUString rates::getImplementationName() { return ou(catalog::implementation_name); }
sal_Bool rates::supportsService(const OUString& name) { return cppu::supportsService(this, name); }
css::uno::Sequence<OUString> rates::getSupportedServiceNames() {
    const OUString names[2] = {ou(catalog::service_name), "com.sun.star.sheet.AddIn"};
    return css::uno::Sequence<OUString>(names, 2);
}

}  // namespace tallyrates::uno

// Passive registration: named by the constructor= attribute in
// tallyrates.components.
extern "C" SAL_DLLPUBLIC_EXPORT css::uno::XInterface* org_tallyrates_sheet_Rates_get_implementation(
    css::uno::XComponentContext*, const css::uno::Sequence<css::uno::Any>&) {
    auto* instance = new tallyrates::uno::rates();
    instance->acquire();
    return static_cast<cppu::OWeakObject*>(instance);
}
