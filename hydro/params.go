package hydro

import (
	"regexp"
	"strings"
)

// class is how a parameter's cells are read.
type class int

const (
	clText    class = iota // kept as text
	clConc                 // analyte concentration (Measurement)
	clTemp                 // degrees C
	clLength               // metres
	clEC                   // uS/cm
	clTDS                  // mg/L
	clDensity              // kg/L
	clPH                   // pH units
	clDegrees              // decimal degrees
	clCoord                // projected metres
	clInt                  // EPSG code
	clDate
	clScreen   // free-text interval
	clDO       // dissolved oxygen, mg/L
	clMV       // redox potential, mV
	clPE       // pe, dimensionless
	clPressure // bar (absolute)
	// long-shape structure columns
	clLongParam
	clLongValue
	clLongUnit
	clLongQual
	clLongDL
)

// Field parameter keys (besides the analyte keys).
const (
	pSampleID     = "SampleID"
	pSampleNo     = "SampleNo" // "no", "nr": a sample id of second rank
	pID           = "ID"       // bare "id": sample id of last rank, else well id
	pWellID       = "WellID"
	pRound        = "Round"
	pDate         = "Date"
	pTime         = "Time"
	pLat          = "Lat"
	pLon          = "Lon"
	pEasting      = "Easting"
	pNorthing     = "Northing"
	pEPSG         = "EPSG"
	pElev         = "GroundElev"
	pDepth        = "Depth"
	pScreen       = "Screen"
	pScreenTop    = "ScreenTop"
	pScreenBottom = "ScreenBottom"
	pTemp         = "Temp"
	pPH           = "pH"
	pPHField      = "pHField"
	pPHLab        = "pHLab"
	pSpecCond     = "SpecCond"
	pTDS          = "TDS"
	pDensity      = "Density"
	pDO           = "DissolvedOxygen"
	pEh           = "Eh"
	pORP          = "ORP"
	pPE           = "pe"
	pPressure     = "Pressure"
	pParameter    = "Parameter"
	pValue        = "Value"
	pUnit         = "Unit"
	pQualifier    = "Qualifier"
	pDL           = "DetectionLimit"
)

type fieldDef struct {
	class   class
	aliases string // space-separated normalised spellings
}

var fieldDefs = map[string]fieldDef{
	pSampleID:     {clText, "sampleid sample samplename samplecode sampleno samplenumber samplenr samplecode labid labno labnumber labsampleid sampid sid sampleidentifier samplelabel"},
	pSampleNo:     {clText, "no nr number num"},
	pID:           {clText, "id"},
	pWellID:       {clText, "well wellid wellname wellno wellcode borehole boreholeid bore boreid station stationid stationname site siteid sitecode sitename locationid locid monitoringwell mw pointid point"},
	pRound:        {clText, "round event campaign samplinground samplingevent samplingcampaign survey trip"},
	pDate:         {clDate, "date sampledate datesample samplingdate datesampled collectiondate sampled datetime sampledat datetimesampled dateandtime timestamp sampletimestamp collectiondatetime sampledatetime samplingdatetime datetimecollected"},
	pTime:         {clText, "time sampletime samplingtime timesampled"},
	pLat:          {clDegrees, "lat latitude latdd latdeg ylat"},
	pLon:          {clDegrees, "lon long lng longitude londd londeg xlon"},
	pEasting:      {clCoord, "x easting east coordx xcoord xcoordinate utmx utme utmeasting eastingm"},
	pNorthing:     {clCoord, "y northing north coordy ycoord ycoordinate utmy utmn utmnorthing northingm"},
	pEPSG:         {clInt, "epsg epsgcode crs srid"},
	pElev:         {clLength, "elev elevation groundelevation gl groundlevel surfaceelevation landsurfaceelevation altitude alt z elevm groundelev"},
	pDepth:        {clLength, "depth sampledepth welldepth totaldepth depthm wd samplingdepth"},
	pScreen:       {clScreen, "screen screens screeninterval screenedinterval screendepth screeninginterval"},
	pScreenTop:    {clLength, "screentop topofscreen screenfrom screentopdepth topscreen"},
	pScreenBottom: {clLength, "screenbottom bottomofscreen screento screenbase screenbottomdepth bottomscreen"},
	pTemp:         {clTemp, "temp temperature watertemp watertemperature temperaturewater t wt tw tempc temperaturec fieldtemp fieldtemperature"},
	pPH:           {clPH, "ph"},
	pPHField:      {clPH, "phfield fieldph phf phinsitu insituph phsite"},
	pPHLab:        {clPH, "phlab labph phl phlaboratory laboratoryph"},
	pSpecCond:     {clEC, "ec spc specificconductance spcond conductivity cond sc ec25 electricalconductivity specificconductivity spcondmeasured fieldec labec"},
	pTDS:          {clTDS, "tds totaldissolvedsolids dissolvedsolids tdsmeasured tds180 residueonevaporation"},
	pDensity:      {clDensity, "density rho specificgravity sg spgrav spgr"},
	pDO:           {clDO, "do dissolvedoxygen oxygen o2 do2 dissolvedo2 fielddo"},
	pEh:           {clMV, "eh redox redoxpotential ehshe ehmv"},
	pORP:          {clMV, "orp oxidationreductionpotential orpmv"},
	pPE:           {clPE, "pe electronactivity"},
	pPressure:     {clPressure, "pressure pressurebar insitupressure reservoirpressure formationpressure porepressure"},
	pParameter:    {clLongParam, "parameter analyte determinand constituent characteristic characteristicname component param variable compound test analysis parametername analytename"},
	pValue:        {clLongValue, "value result concentration conc resultvalue measuredvalue reading resultnumeric"},
	pUnit:         {clLongUnit, "unit units uom resultunit unitofmeasure unitcode"},
	pQualifier:    {clLongQual, "qualifier qual flag remark remarkcode resultqualifier qualifiercode lessthan detectionflag"},
	pDL:           {clLongDL, "detectionlimit dl mdl rl reportinglimit lod loq lor mrl pql methoddetectionlimit limitofreporting"},
}

// analyteAliases: normalised spelling -> analyte key and implied basis.
var analyteAliases = map[string][2]string{}

func init() {
	add := func(key, as, names string) {
		for _, n := range strings.Fields(names) {
			analyteAliases[n] = [2]string{key, as}
		}
	}
	add("Ca", "", "ca calcium")
	add("Mg", "", "mg magnesium")
	add("Na", "", "na sodium")
	add("K", "", "k potassium")
	add(keyNaK, "", "nak kna naplusk nakasna sodiumpluspotassium sodiumandpotassium sodiumpotassium alkalis")
	add("Sr", "", "sr strontium")
	add("Ba", "", "ba barium")
	add("Fe", "", "fe iron fe2 feii ferrous")
	add("Fe3", "", "fe3 feiii ferric")
	add("Mn", "", "mn manganese mn2 mnii")
	add("Li", "", "li lithium")
	add("NH4", "", "nh4 ammonium")
	add("NH4", "N", "nh4n ammonian ammoniumn ammonianitrogen nh3n")
	add("Al", "", "al aluminium aluminum")
	add("Cl", "", "cl chloride")
	add("SO4", "", "so4 sulfate sulphate")
	add("SO4", "S", "so4s sulfates")
	add("Alk", "", "alk alkalinity totalalkalinity talk alkalinitytotal alkt tac alkalinitytitration")
	add("HCO3", "", "hco3 bicarbonate hydrogencarbonate")
	add("CO3", "", "co3 carbonate")
	add("TIC", "", "tic dic totalinorganiccarbon dissolvedinorganiccarbon inorganiccarbon")
	add("F", "", "f fluoride")
	add("SiO2", "", "sio2 silica")
	add("SiO2", "Si", "si silicon")
	add("NO3", "", "no3 nitrate")
	add("NO3", "N", "no3n nitraten nitratenitrogen nitrateasn no3asn")
	add("NO2", "", "no2 nitrite")
	add("NO2", "N", "no2n nitriten")
	add("Br", "", "br bromide")
	add("PO4", "", "po4 phosphate orthophosphate")
	add("PO4", "P", "po4p phosphatep orthophosphatep")
	add("HS", "", "sulfide sulphide h2s hs totalsulfide dissolvedsulfide sulfides")
}

var fieldAliases = map[string]string{}

func init() {
	for k, d := range fieldDefs {
		for _, n := range strings.Fields(d.aliases) {
			fieldAliases[n] = k
		}
	}
}

// colSpec is how one column (or long-shape parameter name) is read.
type colSpec struct {
	Param   string // analyte key, field key or "" (unmapped)
	Class   class
	Sub     string // "qualifier" or "dl" for an analyte's companion column
	Unit    Unit   // analytes
	FUnit   fieldUnit
	UnitRaw string // unit text found, "" if none
	UnitErr string // unit text that could not be understood
	UnitSrc string // where the unit came from when not the header
	Note    string
}

func alnum(s string) string {
	var b strings.Builder
	for _, r := range strings.ToLower(s) {
		if r >= 'a' && r <= 'z' || r >= '0' && r <= '9' {
			b.WriteRune(r)
		}
	}
	return b.String()
}

var (
	reBracket   = regexp.MustCompile(`[\(\[\{]([^\)\]\}]*)[\)\]\}]`)
	reTokens    = regexp.MustCompile(`[\s_,;:]+`)
	reCharge    = regexp.MustCompile(`^(.*?)(\d?[+-]+|[+-]+\d?)$`)
	fillerWords = map[string]bool{"dissolved": true, "diss": true, "dis": true, "filtered": true, "filt": true, "total": true, "tot": true, "conc": true, "concentration": true, "measured": true}
	subWords    = map[string]string{"qualifier": "qualifier", "qual": "qualifier", "flag": "qualifier", "q": "qualifier", "remark": "qualifier",
		"dl": "dl", "mdl": "dl", "rl": "dl", "lod": "dl", "lor": "dl", "loq": "dl", "detectionlimit": "dl", "reportinglimit": "dl"}
)

// lookupName finds the parameter for a list of name tokens.
func lookupName(tokens []string) (key, as string, ok bool) {
	try := func(toks []string) (string, string, bool) {
		if len(toks) == 0 {
			return "", "", false
		}
		joined := strings.ToLower(strings.Join(toks, ""))
		k := alnum(joined)
		if a, ok := analyteAliases[k]; ok {
			return a[0], a[1], true
		}
		if f, ok := fieldAliases[k]; ok {
			return f, "", true
		}
		if m := reCharge.FindStringSubmatch(joined); m != nil {
			k = alnum(m[1])
			if a, ok := analyteAliases[k]; ok {
				return a[0], a[1], true
			}
		}
		return "", "", false
	}
	if k, a, ok := try(tokens); ok {
		return k, a, true
	}
	var kept []string
	for _, t := range tokens {
		if !fillerWords[alnum(t)] {
			kept = append(kept, t)
		}
	}
	if len(kept) != len(tokens) {
		return try(kept)
	}
	return "", "", false
}

func classOf(key string) class {
	if _, ok := analytes[key]; ok {
		return clConc
	}
	return fieldDefs[key].class
}

// isAnyUnit says whether s reads as some unit (used to tell "(mg/L)" from
// "(lab)" in a header).
func isAnyUnit(s string) bool {
	if _, ok := parseConcUnit(s); ok {
		return true
	}
	for _, c := range []class{clTemp, clLength, clEC, clDensity, clDegrees, clMV, clPressure} {
		if _, ok := parseFieldUnit(c, s); ok {
			return true
		}
	}
	return false
}

// bareKey is the analyte a header names once its brackets are removed.
func bareKey(h string) string {
	toks := reTokens.Split(strings.TrimSpace(reBracket.ReplaceAllString(h, " ")), -1)
	if k, _, ok := lookupName(toks); ok {
		return k
	}
	return ""
}

// A column name longer than maxHeaderLen bytes or with more than
// maxHeaderWords separators is not read as a parameter (the longest names
// met, such as "Alkalinity, total as CaCO3 (mg/L at 25 C)", are well
// within: common practice).
const (
	maxHeaderLen   = 120
	maxHeaderWords = 12
)

// parseHeader works out what a column header (or a long-shape parameter
// name) means.
func parseHeader(h string) colSpec {
	h = strings.TrimSpace(strings.Trim(strings.TrimSpace(h), `"'`))
	if len(h) > maxHeaderLen || strings.Count(h, " ")+strings.Count(h, "_") > maxHeaderWords {
		// A sentence, not a column name; also keeps the search below
		// (which tries every split of the words) small.
		return colSpec{}
	}
	var units []string
	var extraName []string
	for _, m := range reBracket.FindAllStringSubmatch(h, -1) {
		c := strings.TrimSpace(m[1])
		switch {
		case c == "":
		case basisNames[alnum(c)] != "" && alnum(c) != "c":
			// "Nitrate (N)", "Silica (Si)", "Alkalinity (CaCO3)"
			units = append(units, "as "+c)
		case analyteAliases[alnum(c)][0] != "" && analyteAliases[alnum(c)][0] == bareKey(h):
			// "Calcium (Ca)", "Potassium (K)": the symbol repeats the name.
		case isAnyUnit(c):
			units = append(units, c)
		default:
			extraName = append(extraName, c)
		}
	}
	name := reBracket.ReplaceAllString(h, " ")
	tokens := reTokens.Split(strings.TrimSpace(name), -1)
	tokens = append(tokens, extraName...)
	var clean []string
	for _, t := range tokens {
		if t = strings.TrimSpace(t); t != "" {
			clean = append(clean, t)
		}
	}
	tokens = clean
	if len(tokens) == 0 {
		return colSpec{}
	}
	var fallback *colSpec
	for k := len(tokens); k >= 1; k-- {
		key, as, ok := lookupName(tokens[:k])
		if !ok {
			continue
		}
		us := units
		if k < len(tokens) {
			us = append([]string{strings.Join(tokens[k:], " ")}, units...)
		}
		spec, ok := buildSpec(key, as, us, k < len(tokens))
		if ok {
			return spec
		}
		if fallback == nil && spec.Class != clText && looksLikeUnit(strings.Join(tokens[k:], " ")) {
			// "Ca (mg/dL)": the parameter is clear, the unit is not.
			spec, _ = buildSpec(key, as, us, false)
			fallback = &spec
		}
	}
	if fallback != nil {
		return *fallback
	}
	// Companion columns of an analyte: "Ca_qualifier", "Ca DL", "Ca (flag)".
	last := alnum(tokens[len(tokens)-1])
	if len(tokens) >= 2 {
		if two := alnum(tokens[len(tokens)-2] + tokens[len(tokens)-1]); subWords[two] != "" {
			if s := parseHeader(strings.Join(tokens[:len(tokens)-2], " ") + unitSuffix(units)); s.Class == clConc && s.Sub == "" {
				s.Sub = subWords[two]
				return s
			}
		}
		if sub := subWords[last]; sub != "" {
			if s := parseHeader(strings.Join(tokens[:len(tokens)-1], " ") + unitSuffix(units)); s.Class == clConc && s.Sub == "" {
				s.Sub = sub
				return s
			}
		}
	}
	return colSpec{}
}

var reUnitLike = regexp.MustCompile(`(?i)/|^(m|u|µ|μ|n|k)?(g|mol|eq|val)\b|^pp[mbt]$|^deg`)

// looksLikeUnit says whether unknown text after a parameter name is meant
// as a unit.
func looksLikeUnit(s string) bool { return reUnitLike.MatchString(strings.TrimSpace(s)) }

func unitSuffix(units []string) string {
	var b strings.Builder
	for _, u := range units {
		b.WriteString(" (" + u + ")")
	}
	return b.String()
}

// buildSpec combines a parameter with unit texts. strict says the first
// unit text came from the name tokens and must parse for the header split
// to be accepted.
func buildSpec(key, impliedAs string, units []string, strict bool) (colSpec, bool) {
	s := colSpec{Param: key, Class: classOf(key)}
	if s.Class == clConc {
		u := Unit{As: impliedAs}
		for i, t := range units {
			pu, ok := parseConcUnit(t)
			if !ok {
				if i == 0 && strict {
					return s, false
				}
				s.UnitErr = t
				continue
			}
			if pu.Conc != "" {
				u.Conc = pu.Conc
			}
			if pu.As != "" {
				u.As = pu.As
			}
			s.UnitRaw = strings.TrimSpace(s.UnitRaw + " " + t)
		}
		if u.As == key {
			u.As = ""
		}
		s.Unit = u
		return s, true
	}
	if len(units) == 0 {
		s.FUnit, _ = parseFieldUnit(s.Class, "")
		return s, true
	}
	for i, t := range units {
		fu, ok := parseFieldUnit(s.Class, t)
		if !ok {
			if i == 0 && strict {
				return s, false
			}
			s.UnitErr = t
			continue
		}
		s.FUnit = fu
		s.UnitRaw = t
	}
	if s.FUnit.conv == nil {
		s.FUnit, _ = parseFieldUnit(s.Class, "")
	}
	return s, true
}
