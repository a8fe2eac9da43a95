using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Lightfold.Catalog;
using Lightfold.Cosmology;
using Lightfold.Lensing;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold lens</c>: solve one SIE + shear lens from the command line (a hand check of a configuration).</summary>
public static class LensCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var sigma = new Option<double>("--sigma-v") { Description = "lens velocity dispersion [km/s]", Required = true };
        var zLens = new Option<double>("--z-lens") { Description = "lens redshift", Required = true };
        var zSource = new Option<double>("--z-source") { Description = "source redshift (> lens redshift)", Required = true };
        var q = new Option<double>("--q") { Description = "axis ratio b/a in [0.05, 1]", DefaultValueFactory = _ => 1.0 };
        var pa = new Option<double>("--pa") { Description = "lens position angle [deg], North through East", DefaultValueFactory = _ => 0.0 };
        var shear = new Option<double>("--shear") { Description = "external shear γ in [0, 0.9]", DefaultValueFactory = _ => 0.0 };
        var shearPa = new Option<double>("--shear-pa") { Description = "shear position angle [deg] (images stretch along it)", DefaultValueFactory = _ => 0.0 };
        var sx = new Option<double>("--source-x") { Description = "source East offset from the lens centre [arcsec]", Required = true };
        var sy = new Option<double>("--source-y") { Description = "source North offset from the lens centre [arcsec]", Required = true };
        var format = new Option<string>("--format") { Description = "table or json", DefaultValueFactory = _ => "table" };
        format.AcceptOnlyFromAmong("table", "json");
        var caustics = new Option<string?>("--caustics") { Description = "also write the critical curve, caustic and cut to this CSV file" };
        var scenario = new ScenarioOptions();

        var command = new Command("lens", "Solve one SIE + external shear lens: Einstein radius, time-delay distance and every image");
        foreach (var o in new Option[] { sigma, zLens, zSource, q, pa, shear, shearPa, sx, sy, format, caustics }) command.Options.Add(o);
        scenario.AddTo(command);
        command.SetAction(parse =>
        {
            var cosmology = new FlrwCosmology(scenario.Load(parse, context).Cosmology);
            double zl = OptionChecks.Above(parse.GetValue(zLens), "--z-lens", 0, 20), zs = OptionChecks.Above(parse.GetValue(zSource), "--z-source", 0, 20);
            if (zs <= zl) throw new InputException($"--z-source {zs} must exceed --z-lens {zl}");
            double sigmaKms = OptionChecks.Above(parse.GetValue(sigma), "--sigma-v", 0, 2000);
            double thetaE = EinsteinRadius.IsothermalArcsec(sigmaKms, cosmology.AngularDiameterDistanceMpc(zl, zs) / cosmology.AngularDiameterDistanceMpc(zs));
            var lens = new SieShearLens
            {
                ThetaEArcsec = thetaE,
                AxisRatio = OptionChecks.InRange(parse.GetValue(q), "--q", 0.05, 1.0),
                PositionAngleDeg = OptionChecks.InRange(parse.GetValue(pa), "--pa", -360, 360),
                ShearGamma = OptionChecks.InRange(parse.GetValue(shear), "--shear", 0.0, 0.9),
                ShearPositionAngleDeg = OptionChecks.InRange(parse.GetValue(shearPa), "--shear-pa", -360, 360),
            };
            double bx = parse.GetValue(sx), by = parse.GetValue(sy);
            if (!double.IsFinite(bx) || !double.IsFinite(by)) throw new InputException("--source-x and --source-y must be finite");
            double dDt = cosmology.TimeDelayDistanceMpc(zl, zs);
            var solution = LensEquation.Solve(lens, bx, by);
            double daysPerArcsec2 = TimeDelays.DaysPerArcsec2(dDt);

            if (parse.GetValue(caustics) is { } path) WriteCaustics(path, lens);
            if (parse.GetValue(format) == "json") WriteJson(context.Out, thetaE, dDt, solution, daysPerArcsec2);
            else WriteTable(context.Out, thetaE, dDt, solution, daysPerArcsec2);
            return ExitCodes.Ok;
        });
        return command;
    }



    static readonly string[] ImageColumns =
        [Columns.ImageIndex, Columns.XArcsec, Columns.YArcsec, Columns.Magnification, Columns.DelayDays, Columns.Kappa, Columns.Gamma];

    static double[] Row(int index, LensedImage image, double daysPerArcsec2)
        => [index, image.XArcsec, image.YArcsec, image.Magnification, image.RelativeFermatArcsec2 * daysPerArcsec2, image.Kappa, image.Gamma];

    static void WriteTable(TextWriter output, double thetaE, double dDt, ImageSolution solution, double daysPerArcsec2)
    {
        output.WriteLine($"{Columns.ThetaEArcsec} = {thetaE.ToString("G8", CultureInfo.InvariantCulture)}");
        output.WriteLine($"{Columns.TimeDelayDistanceMpc} = {dDt.ToString("G8", CultureInfo.InvariantCulture)}");
        output.WriteLine($"{Columns.NImages} = {solution.Images.Count}" + (solution.Status == ImageSetStatus.Regular ? "" : $"  ({Describe(solution.Status)})"));
        TableOutput.Write(output, "table", ImageColumns, solution.Images.Select((im, i) => Row(i, im, daysPerArcsec2)).ToList());
    }

    static void WriteJson(TextWriter output, double thetaE, double dDt, ImageSolution solution, double daysPerArcsec2)
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            json.WriteStartObject();
            json.WriteNumber(Columns.ThetaEArcsec, thetaE);
            json.WriteNumber(Columns.TimeDelayDistanceMpc, dDt);
            json.WriteNumber(Columns.NImages, solution.Images.Count);
            json.WriteString("status", solution.Status switch { ImageSetStatus.Ring => "ring", ImageSetStatus.OnCaustic => "on_caustic", _ => "regular" });
            json.WriteStartArray("images");
            for (int i = 0; i < solution.Images.Count; i++)
            {
                json.WriteStartObject();
                var row = Row(i, solution.Images[i], daysPerArcsec2);
                for (int c = 0; c < ImageColumns.Length; c++) json.WriteNumber(ImageColumns[c], row[c]);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            json.WriteEndObject();
        }
        output.WriteLine(Encoding.UTF8.GetString(stream.ToArray()));
    }

    static string Describe(ImageSetStatus status) => status switch
    {
        ImageSetStatus.Ring => "source behind the centre of a round lens: an Einstein ring",
        ImageSetStatus.OnCaustic => "source on a caustic: two images merged, magnification capped",
        _ => "regular",
    };

    static void WriteCaustics(string path, SieShearLens lens)
    {
        var curves = CriticalCurves.Compute(lens, 1000);
        var text = new StringBuilder("curve,x_arcsec,y_arcsec\n");
        void Add(string name, Polyline line)
        {
            for (int i = 0; i <= line.Count; i++)   // closed: repeat the first point
                text.Append(name).Append(',').Append(line.X[i % line.Count].ToString("R", CultureInfo.InvariantCulture))
                    .Append(',').Append(line.Y[i % line.Count].ToString("R", CultureInfo.InvariantCulture)).Append('\n');
        }
        Add("tangential_critical", curves.TangentialCritical);
        Add("tangential_caustic", curves.TangentialCaustic);
        Add("cut", curves.Cut);
        AtomicFile.WriteAllText(path, text.ToString());
    }
}
