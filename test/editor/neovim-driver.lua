-- Run by test/editor/neovim.test.ts inside `nvim --headless`, after the documented set-up (the
-- init.lua under test): opens each spec named in $POISE_SPECS (separated by newlines), waits for
-- the server's first diagnostics through Neovim's own LSP client, asks for a hover where
-- $POISE_HOVER says (file:line:column, 1-based), and writes what Neovim holds as JSON to
-- $POISE_OUT. Every wait is bounded; on any failure the error goes into the JSON and Neovim quits.
local v = vim.version()
local out = { neovim = v.major .. "." .. v.minor .. "." .. v.patch, specs = {}, hover = vim.NIL, errors = {} }

local published = {}
local original = vim.lsp.handlers["textDocument/publishDiagnostics"]
vim.lsp.handlers["textDocument/publishDiagnostics"] = function(err, result, ctx, config)
  original(err, result, ctx, config)
  if result then published[result.uri] = true end
end

local function clients_of(buf)
  local list = {}
  if vim.lsp.get_clients then
    list = vim.lsp.get_clients({ bufnr = buf })
  else
    for _, c in pairs(vim.lsp.buf_get_clients(buf)) do table.insert(list, c) end
  end
  local names = {}
  for _, c in ipairs(list) do table.insert(names, c.name) end
  return names
end

local function severity_name(s)
  return ({ "error", "warning", "information", "hint" })[s] or tostring(s)
end

local function open(path, record)
  vim.cmd("edit " .. vim.fn.fnameescape(path))
  local buf = vim.api.nvim_get_current_buf()
  local uri = vim.uri_from_bufnr(buf)
  local arrived = vim.wait(30000, function() return published[uri] == true end, 50)
  local spec = { file = path, filetype = vim.bo[buf].filetype, clients = clients_of(buf), arrived = arrived, diagnostics = {} }
  for _, d in ipairs(vim.diagnostic.get(buf)) do
    local lsp = d.user_data and d.user_data.lsp or {}
    table.insert(spec.diagnostics, {
      line = d.lnum + 1,
      column = d.col + 1,
      severity = severity_name(d.severity),
      code = d.code or lsp.code,
      message = d.message,
    })
  end
  if record then table.insert(out.specs, spec) end
  return buf
end

local function hover(where)
  local file, line, column = where:match("^(.*):(%d+):(%d+)$")
  local buf = open(file, false)
  local params = {
    textDocument = { uri = vim.uri_from_bufnr(buf) },
    position = { line = tonumber(line) - 1, character = tonumber(column) - 1 },
  }
  local replies = vim.lsp.buf_request_sync(buf, "textDocument/hover", params, 20000) or {}
  for _, reply in pairs(replies) do
    if reply.result and reply.result.contents then
      local c = reply.result.contents
      out.hover = type(c) == "table" and (c.value or vim.fn.json_encode(c)) or tostring(c)
    end
  end
end

local ok, err = pcall(function()
  for path in (os.getenv("POISE_SPECS") or ""):gmatch("[^\n]+") do open(path, true) end
  if os.getenv("POISE_HOVER") then hover(os.getenv("POISE_HOVER")) end
end)
if not ok then table.insert(out.errors, tostring(err)) end

local f = io.open(os.getenv("POISE_OUT"), "w")
f:write(vim.fn.json_encode(out))
f:close()
vim.cmd("qall!")
