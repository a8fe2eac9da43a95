using System.Globalization;
using System.Text.Json.Nodes;
using Microsoft.Extensions.Configuration;

namespace Lightfold.Configuration;

/// <summary>Reads typed, range-checked values out of a layered configuration and records them.</summary>
/// <remarks>
/// Every key read is remembered, so that afterwards any key nobody asked for is reported as unknown
/// (with the nearest known key suggested), and the typed values make up the resolved configuration
/// (<see cref="Resolved"/>). Lists replace, never merge: the highest layer that mentions a list
/// defines all of it (Microsoft.Extensions.Configuration alone would merge lists element by element).
/// A list may also be given as one comma-separated string (handy in --set and the environment).
/// </remarks>
public sealed class ConfigReader
{
    readonly IConfigurationRoot root;
    readonly Func<string, string?> lookup;
    readonly string prefix;           // canonical dotted prefix, e.g. "survey.bands.g."
    readonly HashSet<string> known;   // shared: canonical keys (lower case, ':'-separated)
    readonly JsonObject node;

    /// <summary>Starts reading <paramref name="root"/>.</summary>
    public ConfigReader(IConfigurationRoot root)
        : this(root, key => root[key], "", new HashSet<string>(StringComparer.OrdinalIgnoreCase), new JsonObject()) { }

    ConfigReader(IConfigurationRoot root, Func<string, string?> lookup, string prefix, HashSet<string> known, JsonObject node)
    {
        this.root = root;
        this.lookup = lookup;
        this.prefix = prefix;
        this.known = known;
        this.node = node;
    }

    /// <summary>The values read so far, typed, as JSON (the resolved configuration).</summary>
    public JsonObject Resolved => node;

    static string ConfigPath(string dotted) => dotted.Replace('.', ':');

    string Full(string key) => prefix + key;

    string? Raw(string key)
    {
        known.Add(ConfigPath(Full(key)));
        return lookup(ConfigPath(Full(key)));
    }

    InputException Error(string key, string? value, string expected)
        => new($"config key '{Full(key)}' = '{InputException.Shown(value)}': expected {expected}");

    /// <summary>A sub-section, read with the same bookkeeping.</summary>
    public ConfigReader Section(string name)
    {
        var child = new JsonObject();
        node[name] = child;
        return new ConfigReader(root, lookup, Full(name) + ".", known, child);
    }

    /// <summary>A finite number in [min, max].</summary>
    public double Double(string key, double min, double max, string? unit = null)
    {
        string? raw = Raw(key);
        string range = $"a finite number in [{Fmt(min)}, {Fmt(max)}]{(unit is null ? "" : " " + unit)}";
        if (raw is null) throw Error(key, "(missing)", range);
        if (!double.TryParse(raw, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v) || v < min || v > max)
            throw Error(key, raw, range);
        node[key] = v;
        return v;
    }

    /// <summary>An integer in [min, max].</summary>
    public long Long(string key, long min, long max)
    {
        string? raw = Raw(key);
        string range = $"an integer in [{min}, {max}]";
        if (raw is null) throw Error(key, "(missing)", range);
        if (!long.TryParse(raw, NumberStyles.Integer, CultureInfo.InvariantCulture, out long v) || v < min || v > max)
            throw Error(key, raw, range);
        node[key] = v;
        return v;
    }

    /// <summary>An integer in [min, max] that fits an <see cref="int"/>.</summary>
    public int Int(string key, int min, int max) => (int)Long(key, min, max);

    /// <summary>A non-negative 64-bit integer (seeds).</summary>
    public ulong UInt64(string key)
    {
        string? raw = Raw(key);
        if (raw is null || !ulong.TryParse(raw, NumberStyles.Integer, CultureInfo.InvariantCulture, out ulong v))
            throw Error(key, raw ?? "(missing)", $"an integer in [0, {ulong.MaxValue}]");
        node[key] = v;
        return v;
    }

    /// <summary>true or false.</summary>
    public bool Bool(string key)
    {
        string? raw = Raw(key);
        if (raw is null || !bool.TryParse(raw, out bool v)) throw Error(key, raw ?? "(missing)", "true or false");
        node[key] = v;
        return v;
    }

    /// <summary>One of a fixed set of words (case-insensitive); returns the canonical spelling.</summary>
    public string Choice(string key, params string[] allowed)
    {
        string? raw = Raw(key);
        string? match = allowed.FirstOrDefault(a => string.Equals(a, raw?.Trim(), StringComparison.OrdinalIgnoreCase));
        if (match is null) throw Error(key, raw ?? "(missing)", "one of " + string.Join(", ", allowed));
        node[key] = match;
        return match;
    }

    /// <summary>A free-text string (may be empty, never missing).</summary>
    public string Text(string key, int maxLength = 400)
    {
        string? raw = Raw(key);
        if (raw is null) raw = "";
        if (raw.Length > maxLength || raw.Any(char.IsControl)) throw Error(key, raw.Length > 60 ? raw[..60] + "…" : raw, $"text of at most {maxLength} printable characters");
        node[key] = raw;
        return raw;
    }

    /// <summary>A list of finite numbers, each in [min, max]; lists replace rather than merge across layers.</summary>
    public double[] DoubleList(string key, double min, double max, int minCount = 0, int maxCount = 1000)
    {
        var items = ListItems(key);
        var values = new double[items.Count];
        for (int i = 0; i < items.Count; i++)
        {
            string raw = items[i];
            if (!double.TryParse(raw, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v) || v < min || v > max)
                throw Error($"{key}[{i}]", raw, $"a finite number in [{Fmt(min)}, {Fmt(max)}]");
            values[i] = v;
        }
        if (values.Length < minCount || values.Length > maxCount)
            throw Error(key, string.Join(",", items), $"a list of {minCount} to {maxCount} numbers");
        node[key] = new JsonArray(values.Select(v => (JsonNode)JsonValue.Create(v)).ToArray());
        return values;
    }

    /// <summary>A list of words, each one of <paramref name="allowed"/> (or anything if none given), without repeats.</summary>
    public string[] WordList(string key, int minCount, int maxCount, params string[] allowed)
    {
        var items = ListItems(key).Select(s => s.Trim()).ToList();
        var result = new List<string>();
        foreach (string item in items)
        {
            string? match = allowed.Length == 0 ? item : allowed.FirstOrDefault(a => string.Equals(a, item, StringComparison.OrdinalIgnoreCase));
            if (match is null || match.Length == 0) throw Error(key, item, allowed.Length == 0 ? "non-empty words" : "words from " + string.Join(", ", allowed));
            if (result.Contains(match, StringComparer.OrdinalIgnoreCase)) throw Error(key, item, "no repeated entries");
            result.Add(match);
        }
        if (result.Count < minCount || result.Count > maxCount)
            throw Error(key, string.Join(",", items), $"a list of {minCount} to {maxCount} entries");
        node[key] = new JsonArray(result.Select(v => (JsonNode)JsonValue.Create(v)).ToArray());
        return result.ToArray();
    }

    /// <summary>Names of the sub-sections under <paramref name="key"/> (a map of named entries, e.g. bands).</summary>
    public IReadOnlyList<string> ChildNames(string key)
    {
        var section = root.GetSection(ConfigPath(Full(key)));
        known.Add(ConfigPath(Full(key)));
        return section.GetChildren().Select(c => c.Key).ToList();
    }

    // The raw items of a list: from the highest layer that mentions the key at all.
    List<string> ListItems(string key)
    {
        string path = ConfigPath(Full(key));
        known.Add(path);
        known.Add(ListMarker + path);
        foreach (var provider in root.Providers.Reverse())
        {
            var children = provider.GetChildKeys([], path).Distinct(StringComparer.OrdinalIgnoreCase).ToList();
            if (children.Count > 0)
            {
                var indexed = new SortedDictionary<int, string>();
                foreach (string child in children)
                {
                    if (!int.TryParse(child, NumberStyles.None, CultureInfo.InvariantCulture, out int index))
                        throw Error(key, child, "a list (JSON array)");
                    provider.TryGet(path + ":" + child, out string? value);
                    if (value is null) throw Error($"{key}[{index}]", "(object)", "a value, not an object");
                    indexed[index] = value;
                    known.Add(path + ":" + child);
                }
                return indexed.Values.ToList();
            }
            if (provider.TryGet(path, out string? whole))
                return string.IsNullOrWhiteSpace(whole) ? [] : whole.Split(',').Select(s => s.Trim()).ToList();
        }
        throw Error(key, "(missing)", "a list");
    }

    /// <summary>Throws for the first key that no reader asked for, suggesting the nearest known key.</summary>
    public void RejectUnknownKeys()
    {
        foreach (var (key, value) in root.AsEnumerable().OrderBy(kv => kv.Key, StringComparer.Ordinal))
        {
            if (value is null && root.GetSection(key).GetChildren().Any()) continue;   // a section, not a leaf
            if (known.Contains(key) || IsListElement(key)) continue;
            string dotted = key.Replace(':', '.');
            string? nearest = known.Where(k => !k.StartsWith(ListMarker, StringComparison.Ordinal)).Select(k => k.Replace(':', '.'))
                .Select(k => (k, d: Distance(dotted, k)))
                .OrderBy(t => t.d).ThenBy(t => t.k, StringComparer.Ordinal).Select(t => t.k).FirstOrDefault();
            throw new InputException($"unknown config key '{InputException.Shown(dotted, 120)}'" + (nearest is null ? "" : $" (did you mean '{nearest}'?)"));
        }
    }

    // Lower layers' elements of a list that a higher layer replaced are not unknown keys.
    bool IsListElement(string key)
    {
        for (int cut = key.LastIndexOf(':'); cut > 0; cut = key.LastIndexOf(':', cut - 1))
            if (known.Contains(ListMarker + key[..cut])) return true;
        return false;
    }

    const string ListMarker = "list>";

    // Edit distance ignoring case and underscores; a typed prefix of a longer key counts as close.
    static int Distance(string typed, string candidate)
    {
        string a = typed.Replace("_", "").ToLowerInvariant(), b = candidate.Replace("_", "").ToLowerInvariant();
        int whole = Levenshtein(a, b);
        return b.Length > a.Length ? Math.Min(whole, Levenshtein(a, b[..a.Length]) + 1) : whole;
    }

    internal static int Levenshtein(string a, string b)
    {
        var prev = new int[b.Length + 1];
        var curr = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) prev[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            curr[0] = i;
            for (int j = 1; j <= b.Length; j++)
                curr[j] = Math.Min(Math.Min(curr[j - 1] + 1, prev[j] + 1), prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
            (prev, curr) = (curr, prev);
        }
        return prev[b.Length];
    }

    static string Fmt(double v) => v.ToString("G", CultureInfo.InvariantCulture);
}
