// The one stylesheet of the public game-tag pages, inlined so the page is a single small request on a slow
// phone (the CSP allows inline styles, not inline scripts). Colours: our palette; a status colour is
// always shown together with its word.
export const PUBLIC_CSS = `
*{box-sizing:border-box}
html{-webkit-text-size-adjust:100%}
body{margin:0;background:#f4f6fa;color:#14213d;font:1.0625rem/1.5 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;border-top:6px solid #d4a017}
main{max-width:34rem;margin:0 auto;padding:1.25rem 1rem 1.5rem}
h1{font-size:1.5rem;line-height:1.25;margin:.25rem 0}
h2{font-size:1.125rem;margin:1.5rem 0 .5rem}
p{margin:0 0 1rem}
a{color:#14213d;text-decoration-thickness:2px;text-underline-offset:3px}
.kicker{margin:0;font-size:.8125rem;font-weight:700;letter-spacing:.06em;text-transform:uppercase;color:#8a5a00}
.where{margin:0 0 1.25rem;color:#3d4a66}
fieldset{border:0;padding:0;margin:0 0 1.5rem;min-width:0}
legend,.label{display:block;padding:0;margin:0 0 .5rem;font-weight:700}
.choice{display:flex;align-items:center;gap:.75rem;min-height:3.25rem;margin:0 0 .5rem;padding:.7rem 1rem;background:#fff;border:2px solid #c9d0de;border-radius:.6rem;cursor:pointer}
.choice input{flex:none;width:1.4rem;height:1.4rem;margin:0;accent-color:#14213d}
.choice:has(input:checked){border-color:#14213d;background:#fff8e1}
.field{margin:0 0 1.5rem}
textarea,input[type=tel]{display:block;width:100%;padding:.7rem .8rem;font:inherit;color:inherit;background:#fff;border:2px solid #8792a8;border-radius:.5rem}
textarea{min-height:6.5rem;resize:vertical}
input[type=file]{display:block;width:100%;padding:.7rem;font:inherit;background:#fff;border:2px dashed #8792a8;border-radius:.5rem}
textarea[aria-invalid=true],input[aria-invalid=true]{border-color:#a3161a}
.opt{font-weight:400;color:#3d4a66}
.hint{margin:.25rem 0 .5rem;font-size:.9375rem;color:#3d4a66}
.error{margin:.25rem 0 .5rem;font-weight:700;color:#a3161a}
.summary{margin:0 0 1.25rem;padding:.75rem 1rem;background:#fff;border:2px solid #a3161a;border-radius:.6rem}
.summary p{margin:0 0 .25rem;font-weight:700;color:#a3161a}
.summary ul{margin:0;padding-left:1.25rem}
.check{display:flex;align-items:flex-start;gap:.75rem;min-height:3rem;padding:.5rem 0;cursor:pointer}
.check input{flex:none;width:1.4rem;height:1.4rem;margin:.15rem 0 0;accent-color:#14213d}
button{display:block;width:100%;min-height:3.25rem;padding:.75rem 1rem;font:inherit;font-size:1.125rem;font-weight:700;color:#fff;background:#14213d;border:0;border-radius:.6rem;cursor:pointer}
button:active{background:#0b1428}
button[disabled]{background:#3d4a66}
:focus-visible{outline:3px solid #d4a017;outline-offset:2px}
.card{margin:0 0 1rem;padding:1rem;background:#fff;border:1px solid #d8dde8;border-radius:.75rem}
.card p:last-child{margin-bottom:0}
.big{font-size:1.25rem;font-weight:700}
.link{word-break:break-all}
.badge{display:inline-block;padding:.3rem .8rem;font-weight:700;color:#fff;border-radius:999px}
.s-running{background:#11643a}.s-attention{background:#8a4b00}.s-down{background:#a3161a}.s-neutral{background:#14213d}
.timeline{margin:0;padding:0;list-style:none}
.timeline li{display:flex;flex-wrap:wrap;justify-content:space-between;gap:.25rem 1rem;padding:.6rem 0;border-bottom:1px solid #d8dde8}
.timeline li:last-child{border-bottom:0}
time{color:#3d4a66;font-variant-numeric:tabular-nums}
footer{max-width:34rem;margin:0 auto;padding:0 1rem 2rem;font-size:.875rem;color:#3d4a66}
`;
