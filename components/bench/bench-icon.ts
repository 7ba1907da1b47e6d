/** The bench view's mark: a caliper's beam and jaws in paper white on layout-dye blue, a scribed line in orange between the jaws. */
export const BENCH_ICON_SVG = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512">
<rect width="512" height="512" rx="104" fill="#1d3f8f"/>
<rect x="84" y="118" width="344" height="52" rx="10" fill="#f7f4ec"/>
<path d="M120 132v24M152 132v16M184 132v24M216 132v16M248 132v24M280 132v16M312 132v24M344 132v16M376 132v24" stroke="#1d3f8f" stroke-width="6"/>
<path d="M92 170h64v178l-32 52-32-52z" fill="#f7f4ec"/>
<rect x="300" y="96" width="104" height="96" rx="12" fill="#f7f4ec"/>
<path d="M340 192h64v156l-32 52-32-52z" fill="#f7f4ec"/>
<path d="M176 300h144" stroke="#e0702c" stroke-width="18" stroke-linecap="round"/>
</svg>`;
