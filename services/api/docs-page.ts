/**
 * The browsable API reference served at /docs: one self-contained HTML page that fetches
 * /openapi.json and lists every path and method with its parameters, request and response schemas
 * and examples. Plain HTML and JavaScript, no external assets (nothing is downloaded at run time);
 * all text from the document is inserted with textContent, never as HTML.
 */
export const DOCS_PAGE = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>cpreg API reference</title>
<link rel="icon" href="data:,">
<style>
  :root { --fg:#1d2330; --muted:#5b6475; --line:#d9dde5; --bg:#fafbfc; --accent:#1f5fbf; }
  * { box-sizing: border-box; }
  body { margin:0; font:15px/1.5 system-ui, sans-serif; color:var(--fg); background:var(--bg); }
  header { padding:16px 24px; border-bottom:1px solid var(--line); background:#fff; position:sticky; top:0; }
  header h1 { margin:0; font-size:20px; }
  header p { margin:4px 0 0; color:var(--muted); }
  #filter { margin-top:8px; width:100%; max-width:420px; padding:6px 8px; border:1px solid var(--line); border-radius:4px; }
  main { display:grid; grid-template-columns: 260px minmax(0, 1fr); gap:24px; padding:16px 24px; }
  .schema, td, pre, p { overflow-wrap:anywhere; }
  nav { position:sticky; top:120px; align-self:start; max-height:80vh; overflow:auto; font-size:13px; }
  nav a { display:block; color:var(--fg); text-decoration:none; padding:2px 0; }
  nav a:hover { color:var(--accent); }
  section.op { background:#fff; border:1px solid var(--line); border-radius:6px; padding:12px 16px; margin-bottom:16px; }
  /* The method is a plain label in the text colour, the same for every method: the path carries the weight. */
  .method { display:inline-block; min-width:64px; font-family: ui-monospace, monospace; font-weight:600; font-size:13px;
            color:var(--fg); margin-right:8px; text-transform:uppercase; }
  .path { font-family: ui-monospace, monospace; font-weight:600; }
  h3 { font-size:14px; margin:12px 0 4px; }
  table { border-collapse:collapse; width:100%; font-size:13px; }
  th, td { text-align:left; border-bottom:1px solid var(--line); padding:4px 6px; vertical-align:top; }
  pre { background:#f3f5f8; border:1px solid var(--line); padding:8px; overflow:auto; font-size:12px; border-radius:4px; }
  .muted { color:var(--muted); } .req { color:#b3261e; font-weight:600; }
  .schema { font-family: ui-monospace, monospace; font-size:12px; }
  .schema ul { list-style:none; margin:0; padding-left:16px; border-left:1px dotted var(--line); }
  .tag { display:inline-block; font-size:11px; border:1px solid var(--line); border-radius:10px; padding:0 6px; margin-left:6px; color:var(--muted); }
  #error { color:#b3261e; }
</style>
</head>
<body>
<header>
  <h1 id="title">cpreg API reference</h1>
  <p id="subtitle">Loading /openapi.json…</p>
  <p><a href="/docs/errors">Error catalogue</a>: every problem code this service answers, its status and what to do.</p>
  <input id="filter" type="search" placeholder="Filter by path, method or summary" aria-label="Filter operations">
</header>
<main>
  <nav id="toc" aria-label="Operations"></nav>
  <div id="ops"><p id="error"></p></div>
</main>
<script>
(function () {
  'use strict';
  var METHODS = ['get', 'post', 'put', 'patch', 'delete', 'head', 'options'];
  var doc = null;

  function el(tag, attrs, children) {
    var node = document.createElement(tag);
    Object.keys(attrs || {}).forEach(function (k) {
      if (k === 'text') node.textContent = attrs[k]; else node.setAttribute(k, attrs[k]);
    });
    (children || []).forEach(function (c) { if (c) node.appendChild(c); });
    return node;
  }

  function resolveRef(ref) {
    var prefix = '#/components/schemas/';
    if (typeof ref === 'string' && ref.indexOf(prefix) === 0) {
      var name = ref.slice(prefix.length);
      return { name: name, schema: (doc.components && doc.components.schemas || {})[name] };
    }
    return { name: ref, schema: undefined };
  }

  function typeLabel(schema) {
    if (!schema) return 'any';
    if (schema.$ref) return resolveRef(schema.$ref).name;
    var t = Array.isArray(schema.type) ? schema.type.join(' | ') : (schema.type || (schema.oneOf ? 'one of' : schema.anyOf ? 'any of' : 'any'));
    if (t === 'array' && schema.items) t = 'array of ' + typeLabel(schema.items);
    var extras = [];
    if (schema.format) extras.push(schema.format);
    if (schema.enum) extras.push('one of ' + schema.enum.join(', '));
    if (schema.minimum !== undefined) extras.push('≥ ' + schema.minimum);
    if (schema.maximum !== undefined) extras.push('≤ ' + schema.maximum);
    if (schema.maxLength !== undefined) extras.push('≤ ' + schema.maxLength + ' chars');
    if (schema.maxItems !== undefined) extras.push('≤ ' + schema.maxItems + ' items');
    if (schema.default !== undefined) extras.push('default ' + JSON.stringify(schema.default));
    return t + (extras.length ? ' (' + extras.join('; ') + ')' : '');
  }

  function renderSchema(schema, depth, seen) {
    seen = seen || [];
    var box = el('div', { 'class': 'schema' });
    if (!schema) return box;
    if (schema.$ref) {
      var r = resolveRef(schema.$ref);
      if (seen.indexOf(r.name) >= 0 || depth > 6) { box.appendChild(el('span', { text: r.name + ' (see above)' })); return box; }
      return renderSchema(r.schema, depth, seen.concat([r.name]));
    }
    if (schema.description && depth === 0) box.appendChild(el('div', { 'class': 'muted', text: schema.description }));
    var props = schema.properties || (schema.items && schema.items.properties) || null;
    var target = schema.properties ? schema : (schema.items || {});
    if (!props) {
      box.appendChild(el('span', { text: typeLabel(schema) }));
      ['oneOf', 'anyOf', 'allOf'].forEach(function (k) {
        if (schema[k]) schema[k].forEach(function (s) { box.appendChild(renderSchema(s, depth + 1, seen)); });
      });
      return box;
    }
    if (schema.type === 'array') box.appendChild(el('span', { 'class': 'muted', text: 'array of:' }));
    var list = el('ul');
    var required = target.required || [];
    Object.keys(props).forEach(function (name) {
      var p = props[name];
      var li = el('li', {}, [
        el('span', { text: name }),
        required.indexOf(name) >= 0 ? el('span', { 'class': 'req', text: ' *' }) : null,
        el('span', { 'class': 'muted', text: ': ' + typeLabel(p) + (p && p.description ? ' — ' + p.description : '') }),
      ]);
      if (p && (p.properties || (p.items && (p.items.properties || p.items.$ref)) || p.$ref) && depth < 6) {
        li.appendChild(renderSchema(p.$ref ? p : (p.properties ? p : p.items), depth + 1, seen));
      }
      list.appendChild(li);
    });
    box.appendChild(list);
    return box;
  }

  function examplesOf(media) {
    var out = [];
    if (!media) return out;
    if (media.example !== undefined) out.push(media.example);
    if (media.examples) Object.keys(media.examples).forEach(function (k) {
      var ex = media.examples[k]; out.push(ex && ex.value !== undefined ? ex.value : ex);
    });
    if (!out.length && media.schema && media.schema.example !== undefined) out.push(media.schema.example);
    return out;
  }

  function schemaLink(ref) {
    var name = resolveRef(ref).name;
    return el('div', { 'class': 'schema' }, [el('a', { href: '#schema-' + name, text: name }), el('span', { 'class': 'muted', text: ' (see Schemas)' })]);
  }

  function renderContent(content) {
    var wrap = el('div');
    Object.keys(content || {}).forEach(function (type) {
      var media = content[type];
      wrap.appendChild(el('div', { 'class': 'muted', text: type }));
      // A named schema (e.g. Problem) is shown once under Schemas and linked from here.
      wrap.appendChild(media.schema && media.schema.$ref ? schemaLink(media.schema.$ref) : renderSchema(media.schema, 0));
      examplesOf(media).forEach(function (ex) {
        wrap.appendChild(el('pre', { text: typeof ex === 'string' ? ex : JSON.stringify(ex, null, 2) }));
      });
    });
    return wrap;
  }

  function renderOperation(path, method, op, pathParams) {
    var id = (method + '-' + path).replace(/[^A-Za-z0-9]+/g, '-');
    var section = el('section', { 'class': 'op', id: id, 'data-search': (method + ' ' + path + ' ' + (op.summary || '')).toLowerCase() });
    section.appendChild(el('div', {}, [
      el('span', { 'class': 'method', text: method }),
      el('span', { 'class': 'path', text: path }),
    ].concat((op.tags || []).map(function (t) { return el('span', { 'class': 'tag', text: t }); }))));
    if (op.summary) section.appendChild(el('p', { text: op.summary }));
    if (op.description) section.appendChild(el('p', { 'class': 'muted', text: op.description }));
    var security = op.security !== undefined ? op.security : doc.security;
    section.appendChild(el('p', { 'class': 'muted', text: security && security.length ? 'Needs an API key (Authorization: Bearer …).' : 'Open: no API key needed.' }));

    var params = (pathParams || []).concat(op.parameters || []);
    if (params.length) {
      section.appendChild(el('h3', { text: 'Parameters' }));
      var table = el('table', {}, [el('tr', {}, ['Name', 'In', 'Type', 'Description'].map(function (h) { return el('th', { text: h }); }))]);
      params.forEach(function (p) {
        table.appendChild(el('tr', {}, [
          el('td', {}, [el('span', { text: p.name }), p.required ? el('span', { 'class': 'req', text: ' *' }) : null]),
          el('td', { text: p.in }),
          el('td', { text: typeLabel(p.schema) }),
          el('td', { text: p.description || (p.schema && p.schema.description) || '' }),
        ]));
      });
      section.appendChild(table);
    }
    if (op.requestBody) {
      section.appendChild(el('h3', { text: 'Request body' + (op.requestBody.required ? ' (required)' : '') }));
      section.appendChild(renderContent(op.requestBody.content));
    }
    if (op.responses) {
      section.appendChild(el('h3', { text: 'Responses' }));
      Object.keys(op.responses).forEach(function (status) {
        var res = op.responses[status];
        section.appendChild(el('div', {}, [el('strong', { text: status + ' ' }), el('span', { 'class': 'muted', text: res.description || '' })]));
        if (res.content) section.appendChild(renderContent(res.content));
      });
    }
    return section;
  }

  function render() {
    document.getElementById('title').textContent = (doc.info && doc.info.title || 'API') + ' ' + (doc.info && doc.info.version || '');
    document.getElementById('subtitle').textContent = (doc.info && doc.info.description) || ('OpenAPI ' + doc.openapi);
    var ops = document.getElementById('ops');
    var toc = document.getElementById('toc');
    Object.keys(doc.paths || {}).sort().forEach(function (path) {
      var item = doc.paths[path];
      METHODS.forEach(function (method) {
        if (!item[method]) return;
        var section = renderOperation(path, method, item[method], item.parameters);
        ops.appendChild(section);
        toc.appendChild(el('a', { href: '#' + section.id, text: method.toUpperCase() + ' ' + path }));
      });
    });
    var schemas = doc.components && doc.components.schemas || {};
    if (Object.keys(schemas).length) {
      ops.appendChild(el('h2', { text: 'Schemas' }));
      Object.keys(schemas).sort().forEach(function (name) {
        var s = el('section', { 'class': 'op', id: 'schema-' + name, 'data-search': ('schema ' + name).toLowerCase() }, [el('strong', { text: name }), renderSchema(schemas[name], 0)]);
        if (schemas[name].example !== undefined) s.appendChild(el('pre', { text: JSON.stringify(schemas[name].example, null, 2) }));
        ops.appendChild(s);
      });
    }
  }

  document.getElementById('filter').addEventListener('input', function (e) {
    var q = e.target.value.toLowerCase();
    document.querySelectorAll('section.op').forEach(function (s) {
      s.style.display = s.getAttribute('data-search').indexOf(q) >= 0 ? '' : 'none';
    });
  });

  fetch('openapi.json').then(function (r) {
    if (!r.ok) throw new Error('GET /openapi.json answered ' + r.status);
    return r.json();
  }).then(function (d) { doc = d; render(); }).catch(function (err) {
    document.getElementById('error').textContent = 'Cannot load the API description: ' + err.message;
  });
})();
</script>
</body>
</html>
`;
